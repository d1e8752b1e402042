// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();

const FIRST = 'http://127.0.0.1:3000/api/calendar/AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA.ics';
const SECOND = 'http://127.0.0.1:3000/api/calendar/BBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBBB.ics';
const calendarCalls = () => seen.filter((r) => r.path === '/api/me/calendar-feed').map((r) => r.method);

function withFeed() {
  server.use(
    signedInAs(grower),
    ...memberOf([aGarden({ role: 'viewer' })]),
    http.get('/api/me/calendar-feed', () => HttpResponse.json({ url: FIRST, createdAt: '2026-06-01T08:00:00Z' }, { status: 201 })),
    http.post('/api/me/calendar-feed', () => HttpResponse.json({ url: SECOND, createdAt: '2026-06-02T08:00:00Z' }, { status: 201 })),
    http.delete('/api/me/calendar-feed', () => new HttpResponse(null, { status: 204 })),
  );
}

describe('harvest calendar link in settings', () => {
  it('when settings open, then no link is made until asked; asked, the private link is shown and copies', async () => {
    withFeed();
    const { user } = renderApp('/g/1/settings');
    expect(await screen.findByRole('heading', { name: 'Add your harvest dates to a calendar app' })).toBeTruthy();
    expect(screen.getByText(/anyone who has it can see the crops, beds and garden names/)).toBeTruthy();
    expect(calendarCalls()).toEqual([]);

    await user.click(screen.getByRole('button', { name: 'Show my calendar link' }));
    const box = await screen.findByRole<HTMLInputElement>('textbox', { name: 'Your calendar link' });
    expect(box.value).toBe(FIRST);
    expect(calendarCalls()).toEqual(['GET']);

    await user.click(screen.getByRole('button', { name: 'Copy link' }));
    expect(await screen.findByText('Link copied.')).toBeTruthy();
    expect(await navigator.clipboard.readText()).toBe(FIRST);
  });

  it('when the grower makes a new link, then it asks first, and the new link replaces the old one', async () => {
    withFeed();
    const { user } = renderApp('/g/1/settings');
    await user.click(await screen.findByRole('button', { name: 'Show my calendar link' }));
    await screen.findByRole('textbox', { name: 'Your calendar link' });
    await user.click(screen.getByRole('button', { name: 'Make a new link' }));
    expect(screen.getByText('The current link stops working at once: calendar apps that use it need the new one.')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Keep this link' }));
    expect(calendarCalls()).toEqual(['GET']);

    await user.click(screen.getByRole('button', { name: 'Make a new link' }));
    await user.click(screen.getByRole('button', { name: 'Make a new link' }));
    await screen.findByDisplayValue(SECOND);
    expect(calendarCalls()).toEqual(['GET', 'POST']);
  });

  it('when the grower stops the link, then it asks first, sends one DELETE and says the link is stopped', async () => {
    withFeed();
    const { user } = renderApp('/g/1/settings');
    await user.click(await screen.findByRole('button', { name: 'Show my calendar link' }));
    await screen.findByRole('textbox', { name: 'Your calendar link' });
    await user.click(screen.getByRole('button', { name: 'Stop this link' }));
    expect(screen.getByRole('group', { name: 'Stop this calendar link?' })).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Stop the link' }));
    expect(await screen.findByText('Link stopped')).toBeTruthy();
    expect(screen.queryByRole('textbox', { name: 'Your calendar link' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Show my calendar link' })).toBeTruthy();
    expect(calendarCalls()).toEqual(['GET', 'DELETE']);
  });

  it('when the server cannot be reached, then the section says so in words', async () => {
    server.use(signedInAs(grower), ...memberOf([aGarden({ role: 'viewer' })]), http.get('/api/me/calendar-feed', () => HttpResponse.error()));
    const { user } = renderApp('/g/1/settings');
    await user.click(await screen.findByRole('button', { name: 'Show my calendar link' }));
    expect(await screen.findByText(/Can’t reach Heatclock/)).toBeTruthy();
  });
});
