// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();

describe('undelivered alert e-mail in garden settings', () => {
  it('when an owner opens settings, then messages given up on are listed with the address and the server’s words', async () => {
    server.use(
      signedInAs(grower),
      http.get('/api/gardens/:gardenId/mail/failed', () =>
        HttpResponse.json({ items: [{ id: 3, to: 'rosa@example.invalid', subject: 'Bolt risk high from 9 Jun', attempts: 5, lastError: '550 mailbox unavailable', createdAt: '2026-06-09T07:00:00Z' }] }),
      ),
      ...memberOf([aGarden({ role: 'owner' })]),
    );
    renderApp('/g/1/settings');
    expect(await screen.findByText('rosa@example.invalid')).toBeTruthy();
    expect(screen.getByText(/given up after 5 tries \(the mail server said: 550 mailbox unavailable\)/)).toBeTruthy();
  });

  it('when a grower opens settings, then the owner’s list is neither shown nor asked for', async () => {
    server.use(signedInAs(grower), ...memberOf([aGarden({ role: 'grower' })]));
    renderApp('/g/1/settings');
    expect(await screen.findByText('Only the garden’s owner can change these settings.')).toBeTruthy();
    expect(screen.queryByRole('heading', { name: 'E-mail that could not be delivered' })).toBeNull();
    expect(seen.some((r) => r.path.includes('/mail/failed'))).toBe(false);
  });
});
