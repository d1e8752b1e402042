// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import { File as NodeFile } from 'node:buffer';
import { http, HttpResponse } from 'msw';
import type { PhotoDto } from '#shared/schemas/plantings';
import { seen, server, setupClientTests, useBrowserLanguages, useNodeFormData } from './helpers/msw-server';
import { aGarden, aPlanting, aProgress, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

const base = '/api/gardens/1/plantings/5';
const picture = () => new NodeFile([new Uint8Array([0xff, 0xd8, 0xff, 0xe0])], 'north-bed.jpg', { type: 'image/jpeg' }) as unknown as File;
const saved: PhotoDto = { id: 31, plantingId: 5, takenOn: '2025-05-14', caption: 'First true leaves', width: 800, height: 600, bytes: 4, url: `${base}/photos/31`, by: 'Mara Quill' };

function plantingWithPhotos(upload: () => Response) {
  const photos: PhotoDto[] = [];
  server.use(
    signedInAs(grower),
    ...memberOf([aGarden({ role: 'grower' })]),
    http.get(base, () => HttpResponse.json({ planting: aPlanting() })),
    http.get(`${base}/progress`, () => HttpResponse.json(aProgress())),
    http.get(`${base}/log`, () => HttpResponse.json({ items: [], page: 1, pageSize: 200, total: 0 })),
    http.get(`${base}/photos`, () => HttpResponse.json({ photos })),
    http.get(`${base}/photos/31`, () => new HttpResponse(new Uint8Array([0xff, 0xd8]), { headers: { 'Content-Type': 'image/jpeg' } })),
    http.post(`${base}/photos`, () => {
      const res = upload();
      if (res.ok) photos.push(saved);
      return res;
    }),
  );
  return renderApp('/g/1/plantings/5');
}

describe('the photo picker', () => {
  it('when a photo uploads, then the picker and caption are empty again and the new photo shows with its day', async () => {
    await useNodeFormData();
    const { user } = plantingWithPhotos(() => HttpResponse.json({ photo: saved }, { status: 201 }));
    const form = await screen.findByRole('form', { name: 'Add a photo' });
    const input = within(form).getByLabelText('Photo') as HTMLInputElement;
    const caption = within(form).getByLabelText('Caption (optional)') as HTMLInputElement;
    await user.upload(input, picture());
    await user.type(caption, 'First true leaves');
    expect(input.files).toHaveLength(1);

    await user.click(within(form).getByRole('button', { name: 'Add photo' }));

    expect(await screen.findByRole('img', { name: 'First true leaves' })).toBeTruthy();
    expect(screen.getByText('14 May 2025 · First true leaves')).toBeTruthy();
    await waitFor(() => expect(input.files).toHaveLength(0));
    expect(input.value).toBe('');
    expect(caption.value).toBe('');
    const sent = seen.find((r) => r.method === 'POST' && r.path === `${base}/photos`)!.body as FormData;
    expect(sent.get('caption')).toBe('First true leaves');
    expect((sent.get('photo') as Blob & { name: string }).name).toBe('north-bed.jpg');
    // The same picker look as the station upload.
    expect(input.className).toContain('file:bg-paper-sunk');
  });

  it('when the upload is refused, then the chosen photo and caption are kept and the reason shows', async () => {
    await useNodeFormData();
    const { user } = plantingWithPhotos(() => HttpResponse.json({ error: { code: 'file_too_large', message: 'The file is larger than 10 MB.' } }, { status: 413 }));
    const form = await screen.findByRole('form', { name: 'Add a photo' });
    const input = within(form).getByLabelText('Photo') as HTMLInputElement;
    await user.upload(input, picture());
    await user.type(within(form).getByLabelText('Caption (optional)'), 'Bolting');
    await user.click(within(form).getByRole('button', { name: 'Add photo' }));

    expect(await within(form).findByText('The file is larger than 10 MB.')).toBeTruthy();
    expect(input.files).toHaveLength(1);
    expect((within(form).getByLabelText('Caption (optional)') as HTMLInputElement).value).toBe('Bolting');
  });

  it('when no photo is chosen, then the form says so and sends nothing', async () => {
    const { user } = plantingWithPhotos(() => HttpResponse.json({ photo: saved }, { status: 201 }));
    const form = await screen.findByRole('form', { name: 'Add a photo' });
    await user.click(within(form).getByRole('button', { name: 'Add photo' }));
    expect(await within(form).findByText('Choose a photo to add.')).toBeTruthy();
    expect(seen.filter((r) => r.method === 'POST')).toHaveLength(0);
  });
});
