import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { projectRoot } from '../../server/config';

/**
 * WCAG 2.2, definitions of "relative luminance" and "contrast ratio" (W3C Recommendation, 2023),
 * and success criterion 1.4.3: normal text needs at least 4.5:1 against its background.
 */
function luminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}
const contrast = (a: string, b: string) => {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
};

const css = readFileSync(path.join(projectRoot, 'src', 'app', 'styles.css'), 'utf8');
const palette = Object.fromEntries([...css.matchAll(/--color-([\w-]+):\s*(#[0-9a-f]{6});/gi)].map((m) => [m[1], m[2]]));
const TEXT = ['loam', 'loam-soft', 'ember', 'frost', 'leaf', 'clay'];
const BACKGROUNDS = Object.keys(palette).filter((k) => k.startsWith('paper') || k.endsWith('-tint'));

describe('palette contrast (WCAG 2.2 SC 1.4.3)', () => {
  it('when the worked examples are computed, then black on white is 21:1 and white on white 1:1', () => {
    expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 5);
    expect(contrast('#ffffff', '#ffffff')).toBeCloseTo(1, 5);
  });

  it('when any text colour sits on any page or badge background, then it has at least 4.5:1', () => {
    expect(BACKGROUNDS.length).toBeGreaterThanOrEqual(7);
    for (const text of TEXT) {
      for (const bg of BACKGROUNDS) {
        expect(contrast(palette[text], palette[bg]), `${text} on ${bg}`).toBeGreaterThanOrEqual(4.5);
      }
    }
  });
});
