import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import type { UserDto } from '#shared/schemas/auth';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Wordmark } from '@/components/ui/wordmark';
import { useMe } from '@/features/auth/api/get-me';
import { authKeys } from '@/features/auth/api/auth-keys';
import { SignOutButton } from '@/features/auth/components/sign-out-button';
import { useGardens } from '@/features/gardens/api/get-gardens';
import { NameForm } from '@/features/account/components/name-form';
import { EmailChangeForm } from '@/features/account/components/email-change-form';
import { PasswordChangeForm } from '@/features/account/components/password-change-form';
import { SessionsSection } from '@/features/account/components/sessions-section';

const LINK = 'font-semibold text-frost underline';

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-4 rounded-lg border border-line bg-paper-raised p-4 sm:p-6">
      <h2 id={id} className="text-xl font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/**
 * Units and alert e-mails belong to each garden (a garden's settings page holds them), so the
 * account page points there instead of keeping a second copy of those choices.
 */
function GardenChoices() {
  const gardens = useGardens();
  if (gardens.isPending) return <Loading label="Loading your gardens…" />;
  if (gardens.isError) return <LoadProblem error={gardens.error} what="your gardens" onRetry={() => gardens.refetch()} retrying={gardens.isFetching} />;
  if (gardens.data.length === 0) return <p>You are not a member of any garden yet.</p>;
  return (
    <>
      <p>Temperature and length units, and which alerts you get by e-mail and when, are chosen for each garden in its settings.</p>
      <ul className="flex flex-col gap-1">
        {gardens.data.map((g) => (
          <li key={g.id}>
            <Link to={`/g/${g.id}/settings`} className={`${LINK} inline-flex min-h-11 items-center`}>
              {g.name}: settings and alert e-mails
            </Link>
          </li>
        ))}
      </ul>
    </>
  );
}

export function AccountPage() {
  const me = useMe();
  const queryClient = useQueryClient();
  const saved = (user: UserDto) => queryClient.setQueryData(authKeys.me(), user);

  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6 px-4 py-6">
      <title>Account · Heatclock</title>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <Wordmark />
        <SignOutButton />
      </div>
      <main id="main" className="flex flex-col gap-6">
        <div>
          <h1 className="text-2xl font-bold sm:text-3xl">Your account</h1>
          <Link to="/" className={`${LINK} inline-flex min-h-11 items-center`}>
            Back to your garden
          </Link>
        </div>
        {me.isPending && <Loading label="Loading your account…" />}
        {me.isError && <LoadProblem error={me.error} what="your account" onRetry={() => me.refetch()} retrying={me.isFetching} />}
        {me.data && (
          <>
            <Section id="account-name" title="Name">
              <NameForm user={me.data} onSaved={saved} />
            </Section>
            <Section id="account-email" title="E-mail">
              <EmailChangeForm currentEmail={me.data.email} />
            </Section>
            <Section id="account-password" title="Password">
              <PasswordChangeForm />
            </Section>
            <Section id="account-devices" title="Signed-in devices">
              <SessionsSection />
            </Section>
            <Section id="account-gardens" title="Units and alert e-mails">
              <GardenChoices />
            </Section>
          </>
        )}
      </main>
    </div>
  );
}
