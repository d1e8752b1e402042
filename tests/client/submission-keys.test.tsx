// @vitest-environment jsdom
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { File as NodeFile } from 'node:buffer';
import { delay, http, HttpResponse } from 'msw';
import type { PhotoDto } from '#shared/schemas/plantings';
import { PlantingForm } from '@/features/plantings/components/planting-form';
import type { PlantingChoices } from '@/features/plantings/components/planting-form';
import { BedForm } from '@/features/beds/components/bed-form';
import { seen, server, setupClientTests, useBrowserLanguages, useNodeFormData } from './helpers/msw-server';
import { aBed, aGarden, aPlanting, aProgress, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

const posts = (path: string) => seen.filter((r) => r.method === 'POST' && r.path === path);
const keysSent = (path: string) => posts(path).map((r) => r.headers.get('idempotency-key'));

/** Answers each POST in turn with the next of `answers`; the last one repeats. */
function answersInTurn(answers: (() => Response | Promise<Response>)[]) {
  let n = 0;
  return () => answers[Math.min(n++, answers.length - 1)]();
}

const noAnswer = () => HttpResponse.error();
const stillSaving = () =>
  HttpResponse.json(
    { error: { code: 'request_in_progress', message: 'The same entry is still being saved. Wait a moment; it will not be saved twice.' } },
    { status: 409, headers: { 'Retry-After': '1' } },
  );

function withClient(ui: React.ReactNode) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  const user = userEvent.setup();
  render(<QueryClientProvider client={queryClient}>{ui}</QueryClientProvider>);
  return { user };
}

describe('the new-planting form', () => {
  const path = '/api/gardens/1/plantings';
  const choices: PlantingChoices = {
    beds: [{ id: 3, name: 'North 1' }],
    varieties: [{ id: 7, name: 'Copperleaf Butterhead', cropName: 'Lettuce' }],
    seedLots: [],
  };
  const quietPreview = { unit: 'F', target: null, targetNote: '', startEvent: null, startReason: null, maturity: { p10: null, p50: null, p90: null, kind: 'none', note: 'No window yet.' }, boltSeason: null };
  beforeEach(() => server.use(http.get(`${path}/preview`, () => HttpResponse.json(quietPreview))));

  async function fillIn(user: ReturnType<typeof userEvent.setup>) {
    await user.selectOptions(screen.getByRole('combobox', { name: 'Bed' }), '3');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Variety' }), '7');
  }

  it('when the first sending gets no answer, then Save again sends the same Idempotency-Key, and the next planting a new one', async () => {
    const created = () => HttpResponse.json({ planting: aPlanting() }, { status: 201 });
    server.use(http.post(path, answersInTurn([noAnswer, created])));
    const onSaved = vi.fn();
    const { user } = withClient(<PlantingForm gardenId={1} choices={choices} today="2025-04-02" onSaved={onSaved} />);
    await fillIn(user);

    await user.click(screen.getByRole('button', { name: 'Save planting' }));
    expect(await screen.findByText('Can’t reach Heatclock — your entry is kept, try again.')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Save planting' }));
    await waitFor(() => expect(onSaved).toHaveBeenCalledTimes(1));

    // The same entry again, on purpose: another planting.
    await user.click(screen.getByRole('button', { name: 'Save planting' }));
    await waitFor(() => expect(onSaved).toHaveBeenCalledTimes(2));

    const [first, retry, next] = keysSent(path);
    expect(first).toMatch(/^[\x21-\x7e]{8,200}$/);
    expect(retry).toBe(first);
    expect(next).toMatch(/^[\x21-\x7e]{8,200}$/);
    expect(next).not.toBe(first);
    // A quantity left blank is sent as not known, never as 0.
    expect(posts(path)[0].body).toMatchObject({ bedId: 3, varietyId: 7, quantity: null });
  });

  it('when the entry is changed after a failed sending, then it goes with a key of its own', async () => {
    server.use(http.post(path, noAnswer));
    const { user } = withClient(<PlantingForm gardenId={1} choices={choices} today="2025-04-02" onSaved={vi.fn()} />);
    await fillIn(user);
    await user.click(screen.getByRole('button', { name: 'Save planting' }));
    await screen.findByText('Can’t reach Heatclock — your entry is kept, try again.');

    await user.type(screen.getByLabelText('Quantity'), '24');
    await user.click(screen.getByRole('button', { name: 'Save planting' }));
    await waitFor(() => expect(posts(path)).toHaveLength(2));

    const [first, changed] = keysSent(path);
    expect(posts(path)[1].body).toMatchObject({ quantity: 24 });
    expect(changed).not.toBe(first);
  });

  it('when Save is tapped twice quickly, then one planting is sent', async () => {
    server.use(
      http.post(path, async () => {
        await delay(200);
        return HttpResponse.json({ planting: aPlanting() }, { status: 201 });
      }),
    );
    const onSaved = vi.fn();
    const { user } = withClient(<PlantingForm gardenId={1} choices={choices} today="2025-04-02" onSaved={onSaved} />);
    await fillIn(user);
    await user.dblClick(screen.getByRole('button', { name: 'Save planting' }));
    await waitFor(() => expect(onSaved).toHaveBeenCalledTimes(1));
    expect(posts(path)).toHaveLength(1);
  });

  it('when the same entry is still being saved, then the form says so in words', async () => {
    server.use(http.post(path, stillSaving));
    const { user } = withClient(<PlantingForm gardenId={1} choices={choices} today="2025-04-02" onSaved={vi.fn()} />);
    await fillIn(user);
    await user.click(screen.getByRole('button', { name: 'Save planting' }));
    const notice = await screen.findByRole('alert');
    expect(notice.textContent).toContain('Already being saved — wait a moment');
    expect(notice.textContent).not.toContain('request_in_progress');
  });
});

describe('the bed form', () => {
  const path = '/api/gardens/1/beds';

  it('when the first sending gets no answer, then Add bed again sends the same Idempotency-Key, and the next bed a new one', async () => {
    server.use(
      http.post(path, answersInTurn([noAnswer, () => HttpResponse.json({ bed: aBed({ name: 'North 1' }) }, { status: 201 })])),
      http.get(path, () => HttpResponse.json({ beds: [] })),
    );
    const { user } = withClient(<BedForm gardenId={1} system="metric" />);
    const name = screen.getByLabelText<HTMLInputElement>('Name');
    await user.type(name, 'North 1');

    await user.click(screen.getByRole('button', { name: 'Add bed' }));
    expect(await screen.findByText('Can’t reach Heatclock — your entry is kept, try again.')).toBeTruthy();
    expect(name.value).toBe('North 1');
    await user.click(screen.getByRole('button', { name: 'Add bed' }));
    // Saved: the form is empty again for the next bed.
    await waitFor(() => expect(name.value).toBe(''));

    await user.type(name, 'North 2');
    await user.click(screen.getByRole('button', { name: 'Add bed' }));
    await waitFor(() => expect(posts(path)).toHaveLength(3));

    const [first, retry, next] = keysSent(path);
    expect(first).toMatch(/^[\x21-\x7e]{8,200}$/);
    expect(retry).toBe(first);
    // Sides left blank are not known, never 0.
    expect(posts(path)[0].body).toMatchObject({ name: 'North 1', lengthM: null, widthM: null });
    expect(posts(path)[2].body).toMatchObject({ name: 'North 2' });
    expect(next).not.toBe(first);
  });

  it('when the same bed is still being saved, then the form says so in words', async () => {
    server.use(http.post(path, stillSaving));
    const { user } = withClient(<BedForm gardenId={1} system="metric" />);
    await user.type(screen.getByLabelText('Name'), 'North 1');
    await user.click(screen.getByRole('button', { name: 'Add bed' }));
    expect(await screen.findByText('Already being saved — wait a moment, then try again; it will not be saved twice.')).toBeTruthy();
  });
});

describe('the photo upload', () => {
  const base = '/api/gardens/1/plantings/5';
  const picture = () => new NodeFile([new Uint8Array([0xff, 0xd8, 0xff, 0xe0])], 'north-bed.jpg', { type: 'image/jpeg' }) as unknown as File;
  const saved: PhotoDto = { id: 31, plantingId: 5, takenOn: '2025-05-14', caption: '', width: 800, height: 600, bytes: 4, url: `${base}/photos/31`, by: 'Mara Quill' };

  it('when the first upload gets no answer, then Add photo again sends the same Idempotency-Key', async () => {
    await useNodeFormData();
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden({ role: 'grower' })]),
      http.get(base, () => HttpResponse.json({ planting: aPlanting() })),
      http.get(`${base}/progress`, () => HttpResponse.json(aProgress())),
      http.get(`${base}/log`, () => HttpResponse.json({ items: [], page: 1, pageSize: 200, total: 0 })),
      http.get(`${base}/photos`, () => HttpResponse.json({ photos: [] })),
      http.post(`${base}/photos`, answersInTurn([noAnswer, () => HttpResponse.json({ photo: saved }, { status: 201 })])),
    );
    const { user } = renderApp('/g/1/plantings/5');
    const form = await screen.findByRole('form', { name: 'Add a photo' });
    await user.upload(within(form).getByLabelText('Photo'), picture());

    await user.click(within(form).getByRole('button', { name: 'Add photo' }));
    expect(await within(form).findByText('Can’t reach Heatclock — the chosen photo is kept, try again.')).toBeTruthy();
    await user.click(within(form).getByRole('button', { name: 'Add photo' }));
    expect(await within(form).findByText('Photo added')).toBeTruthy();

    const [first, retry] = keysSent(`${base}/photos`);
    expect(first).toMatch(/^[\x21-\x7e]{8,200}$/);
    expect(retry).toBe(first);
  });
});
