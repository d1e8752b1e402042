// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { lazyPart } from '@/lib/lazy-part';
import { useClientWaits } from './helpers/waits';

const WORDS = { loading: 'Opening the page…', failed: 'This page could not be loaded' };

function Greeting({ name }: { name: string }) {
  return <h1>Hello {name}</h1>;
}

/** A download the test finishes by hand, like a chunk arriving over a slow connection. */
function slowDownload() {
  let arrive = () => {};
  const load = () => new Promise<typeof Greeting>((resolve) => (arrive = () => resolve(Greeting)));
  return { load, arrive: () => arrive() };
}

useClientWaits();
afterEach(cleanup);

describe('a part downloaded when first shown', () => {
  it('when its code is still downloading, then the loading line shows, and the part replaces it once it arrives', async () => {
    const download = slowDownload();
    const Part = lazyPart(download.load, WORDS);

    render(<Part name="Rosa" />);

    expect((await screen.findByRole('status')).textContent).toBe('Opening the page…');
    download.arrive();
    expect(await screen.findByRole('heading', { name: 'Hello Rosa' })).toBeTruthy();
    expect(screen.queryByRole('status')).toBeNull();
  });

  it('when its download fails, then the message says so, and Try again downloads it anew', async () => {
    // React reports an error its boundary caught; here that report is the expected one.
    const reported = vi.mocked(console.error).mockImplementation(() => {});
    const load = vi
      .fn<() => Promise<typeof Greeting>>()
      .mockRejectedValueOnce(new TypeError('Failed to fetch dynamically imported module'))
      .mockResolvedValue(Greeting);
    const Part = lazyPart(load, WORDS);
    const user = userEvent.setup();

    render(<Part name="Rosa" />);

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('This page could not be loaded');
    expect(alert.textContent).toContain('Check that you are online');
    expect(reported.mock.calls.flat().some((a) => a instanceof Error && a.name === 'DownloadError')).toBe(true);

    await user.click(screen.getByRole('button', { name: 'Try again' }));

    expect(await screen.findByRole('heading', { name: 'Hello Rosa' })).toBeTruthy();
    expect(load).toHaveBeenCalledTimes(2);
  });

  it('when a failed part is shown again later, then it is downloaded again instead of failing at once', async () => {
    const reported = vi.mocked(console.error).mockImplementation(() => {});
    const load = vi
      .fn<() => Promise<typeof Greeting>>()
      .mockRejectedValueOnce(new TypeError('Failed to fetch dynamically imported module'))
      .mockResolvedValue(Greeting);
    const Part = lazyPart(load, WORDS);
    const first = render(<Part name="Rosa" />);
    await screen.findByRole('alert');
    expect(reported.mock.calls.flat().some((a) => a instanceof Error && a.name === 'DownloadError')).toBe(true);
    first.unmount();

    render(<Part name="Rosa" />);

    expect(await screen.findByRole('heading', { name: 'Hello Rosa' })).toBeTruthy();
    expect(load).toHaveBeenCalledTimes(2);
  });

  it('when it was preloaded, then it shows at once without a loading line', async () => {
    const Part = lazyPart(() => Promise.resolve(Greeting), WORDS);
    await Part.preload();

    render(<Part name="Rosa" />);

    expect(screen.getByRole('heading', { name: 'Hello Rosa' })).toBeTruthy();
  });
});
