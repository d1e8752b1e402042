// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient } from '@tanstack/react-query';
import { http, HttpResponse } from 'msw';
import type { NotificationPreferenceDto } from '#shared/schemas/notifications';
import { AppProviders } from '@/app/providers';
import { NotificationPreferencesSection } from '@/features/notifications/components/notification-preferences-section';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { grower } from './helpers/data';
import { renderApp, signedInAs } from './helpers/render-app';

setupClientTests();

const stored: NotificationPreferenceDto = { gardenId: 1, gardenName: 'Hillside', delivery: 'digest', digestHour: 7, types: ['bolt-risk', 'frost'] };

function renderSection() {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <AppProviders queryClient={queryClient}>
      <NotificationPreferencesSection gardenId={1} />
    </AppProviders>,
  );
  return userEvent.setup();
}

describe('e-mail settings section', () => {
  it('when a member changes delivery, hour and types, then one PUT carries this garden’s choices and the page says saved', async () => {
    server.use(
      http.get('/api/me/notification-preferences', () => HttpResponse.json({ items: [stored] })),
      http.put('/api/me/notification-preferences', async ({ request }) => {
        const { items } = (await request.json()) as { items: NotificationPreferenceDto[] };
        return HttpResponse.json({ items: [{ ...items[0], gardenName: 'Hillside' }] });
      }),
    );
    const user = renderSection();

    await user.click(await screen.findByRole('radio', { name: /Right away/ }));
    await user.selectOptions(screen.getByLabelText('Daily summary at'), '18');
    await user.click(screen.getByRole('checkbox', { name: 'Frost' }));
    await user.click(screen.getByRole('checkbox', { name: 'Heat stress' }));
    await user.click(screen.getByRole('button', { name: 'Save e-mail settings' }));

    expect(await screen.findByText('E-mail settings saved.')).toBeTruthy();
    const put = seen.find((r) => r.method === 'PUT')!;
    expect(put.headers.get('x-requested-with')).toBe('heatclock');
    expect(put.body).toEqual({ items: [{ gardenId: 1, delivery: 'immediate', digestHour: 18, types: ['bolt-risk', 'heat-stress'] }] });
  });

  it('when the server refuses a field, then its message shows under that field', async () => {
    server.use(
      http.get('/api/me/notification-preferences', () => HttpResponse.json({ items: [stored] })),
      http.put('/api/me/notification-preferences', () =>
        HttpResponse.json(
          { error: { code: 'validation_failed', message: 'Please check the fields: items.0.digestHour.', fields: { 'items.0.digestHour': 'Pick an hour from 0 to 23.' } } },
          { status: 400 },
        ),
      ),
    );
    const user = renderSection();

    await user.click(await screen.findByRole('button', { name: 'Save e-mail settings' }));

    expect(await screen.findByText('Pick an hour from 0 to 23.')).toBeTruthy();
    expect(screen.getByLabelText('Daily summary at').getAttribute('aria-invalid')).toBe('true');
  });
});

describe('unsubscribe page', () => {
  it('when a signed-out visitor opens a link and presses the button, then e-mail stops and the page says so', async () => {
    server.use(
      http.get('/api/unsubscribe/:token', () => HttpResponse.json({ gardenName: 'Hillside', memberName: 'Mara Quill', maskedEmail: 'm…@example.org', delivery: 'digest' })),
      http.post('/api/unsubscribe/:token', () => HttpResponse.json({ gardenName: 'Hillside', memberName: 'Mara Quill', maskedEmail: 'm…@example.org', delivery: 'off' })),
    );
    const { user } = renderApp('/unsubscribe/1.2.abc.def');

    expect(await screen.findByText(/Stop all Heatclock e-mail from/)).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Stop e-mail from Hillside' }));

    expect(await screen.findByText('E-mail stopped')).toBeTruthy();
    expect(seen.filter((r) => r.method === 'POST').map((r) => r.path)).toEqual(['/api/unsubscribe/1.2.abc.def']);
  });

  it('when the link was used already, then the page says so and offers no button', async () => {
    server.use(
      http.get('/api/unsubscribe/:token', () =>
        HttpResponse.json({ error: { code: 'unsubscribe_used', message: 'This unsubscribe link has already been used.' } }, { status: 410 }),
      ),
    );
    renderApp('/unsubscribe/1.2.abc.def');

    expect(await screen.findByText('This link has been used')).toBeTruthy();
    expect(screen.queryByRole('button')).toBeNull();
  });
});

describe('test mailbox page', () => {
  it('when messages were captured, then each shows its text and a sandboxed HTML preview', async () => {
    server.use(
      signedInAs(grower),
      http.get('/api/dev/mail', () =>
        HttpResponse.json({
          messages: [{ to: 'mara@example.org', subject: 'Warning · Frost: Frost on 3 May', text: 'Hello Mara Quill,', html: '<h1>Frost</h1><script>alert(1)</script>', receivedAt: '2026-05-02T06:00:00.000Z' }],
        }),
      ),
    );
    renderApp('/mailbox');

    expect(await screen.findByRole('heading', { name: 'Warning · Frost: Frost on 3 May' })).toBeTruthy();
    expect(screen.getByText(/local test mailbox/)).toBeTruthy();
    expect(screen.getByText('Hello Mara Quill,')).toBeTruthy();
    const frame = screen.getByTitle('HTML preview: Warning · Frost: Frost on 3 May');
    expect(frame.getAttribute('sandbox')).toBe('');
  });

  it('when the server sends real e-mail, then the page says there is no test mailbox', async () => {
    server.use(
      signedInAs(grower),
      http.get('/api/dev/mail', () => HttpResponse.json({ error: { code: 'not_found', message: 'No such API route.' } }, { status: 404 })),
    );
    renderApp('/mailbox');

    expect(await screen.findByText('No test mailbox here')).toBeTruthy();
  });
});
