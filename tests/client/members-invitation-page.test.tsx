// @vitest-environment jsdom
import { describe, expect, it, vi } from 'vitest';
import { screen } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { InvitationPreviewDto } from '#shared/schemas/invitations';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, quietToday, renderApp, signedInAs, signedOut } from './helpers/render-app';

setupClientTests();

const TOKEN = 'A'.repeat(43);

function preview(overrides: Partial<InvitationPreviewDto> = {}): InvitationPreviewDto {
  return {
    garden: { name: 'Hollowbrook Teaching Garden' },
    role: 'grower',
    email: 'noor@example.org',
    invitedBy: 'Petra Hale',
    expiresAt: '2026-06-08T10:00:00.000Z',
    accountExists: false,
    signedInMatches: false,
    ...overrides,
  };
}

const answering = (body: InvitationPreviewDto) => http.get('/api/invitations/:token', () => HttpResponse.json(body));
const posts = () => seen.filter((r) => r.method === 'POST');

describe('invitation page', () => {
  it('when the address has no account, then the page shows garden, role and inviter, and a refused password lands under its field', async () => {
    server.use(
      signedOut,
      answering(preview()),
      http.post('/api/invitations/:token/accept', () =>
        HttpResponse.json(
          { error: { code: 'validation_failed', message: 'Please check the fields: password.', fields: { password: 'This password is too easy to guess.' } } },
          { status: 400 },
        ),
      ),
    );
    const { user } = renderApp(`/invitations/${TOKEN}`);

    expect(await screen.findByRole('heading', { name: 'Join “Hollowbrook Teaching Garden”' })).toBeTruthy();
    expect(screen.getByText('Petra Hale invited noor@example.org to this garden.')).toBeTruthy();
    expect(screen.getByText('Grower: a grower adds and changes plantings, varieties, beds and seed lots')).toBeTruthy();
    await user.type(screen.getByLabelText('Your name'), 'Noor Fenwick');
    await user.type(screen.getByLabelText(/^Password/), 'hollowbrook1');
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));

    expect(await screen.findByText('This password is too easy to guess.')).toBeTruthy();
    expect(screen.getByLabelText(/^Password/).getAttribute('aria-invalid')).toBe('true');
    expect(posts()).toMatchObject([{ path: `/api/invitations/${TOKEN}/accept`, body: { name: 'Noor Fenwick', password: 'hollowbrook1' } }]);
  });

  it('when the invited user is signed in, then Join sends an empty body and opens the garden', async () => {
    server.use(
      signedInAs(grower),
      answering(preview({ email: grower.email, accountExists: true, signedInMatches: true })),
      ...memberOf([aGarden({ role: 'grower' })]),
      quietToday,
      http.post('/api/invitations/:token/accept', () => HttpResponse.json({ user: grower, garden: aGarden({ role: 'grower' }) }, { status: 201 })),
    );
    const { user, router } = renderApp(`/invitations/${TOKEN}`);

    await user.click(await screen.findByRole('button', { name: 'Join as grower' }));

    await vi.waitFor(() => expect(router.state.location.pathname).toBe('/g/1'));
    expect(posts()).toMatchObject([{ path: `/api/invitations/${TOKEN}/accept`, body: {} }]);
  });

  it('when the address has an account and nobody is signed in, then the page links to sign in and back', async () => {
    server.use(signedOut, answering(preview({ accountExists: true })));
    renderApp(`/invitations/${TOKEN}`);

    const link = await screen.findByRole('link', { name: 'Sign in first' });
    expect(link.getAttribute('href')).toBe(`/sign-in?next=${encodeURIComponent(`/invitations/${TOKEN}`)}`);
    expect(screen.queryByRole('button', { name: /Join/ })).toBeNull();
    expect(screen.queryByLabelText('Your name')).toBeNull();
  });

  it.each([
    [410, 'invitation_used', 'This invitation has been used', 'This invitation has been used already: each link works once.'],
    [410, 'invitation_revoked', 'This invitation was withdrawn', 'This invitation was withdrawn by the garden’s owner.'],
    [410, 'invitation_expired', 'This invitation has expired', 'This invitation has expired: links work for 7 days.'],
    [404, 'invitation_unknown', 'This invitation link does not work', 'This invitation link does not work: it may have been copied incompletely.'],
  ])('when the link is refused with %i %s, then the page says so in words and offers no form', async (status, code, title, message) => {
    server.use(signedOut, http.get('/api/invitations/:token', () => HttpResponse.json({ error: { code, message } }, { status })));
    renderApp(`/invitations/${TOKEN}`);

    expect(await screen.findByText(title)).toBeTruthy();
    expect(screen.getByText(message)).toBeTruthy();
    expect(screen.queryByRole('button')).toBeNull();
    expect(screen.queryByRole('textbox')).toBeNull();
    // Refused for good: asked once, not retried.
    expect(seen.filter((r) => r.path === `/api/invitations/${TOKEN}`)).toHaveLength(1);
  });
});
