// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { render } from '@testing-library/react';
import { GardenFacts } from '@/features/gardens/components/garden-facts';
import { aGarden } from './helpers/data';

/** HTML: a dl's children are dt/dd groups, each either direct or wrapped in exactly one div. */
function pairedCorrectly(dl: HTMLDListElement): boolean {
  return [...dl.querySelectorAll('dt, dd')].every((el) => {
    const parent = el.parentElement!;
    return parent === dl || (parent.tagName === 'DIV' && parent.parentElement === dl);
  });
}

describe('garden facts as a definition list', () => {
  it('when the garden’s facts are shown, then every label and value sit where screen readers pair them', () => {
    const { container } = render(<GardenFacts garden={aGarden()} showName />);
    const dl = container.querySelector('dl')!;
    expect(dl.querySelectorAll('dt')).toHaveLength(6);
    expect(pairedCorrectly(dl)).toBe(true);
    // The icon stays out of the label's name.
    expect([...dl.querySelectorAll('dt')].map((dt) => dt.textContent)).toContain('Time zone');
  });
});
