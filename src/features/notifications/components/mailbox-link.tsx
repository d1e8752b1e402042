import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';

const QUIET = 'inline-flex min-h-11 items-center text-sm text-loam-soft underline underline-offset-2 hover:text-loam';

/** A quiet link to the local test mailbox, for the account area of the header or the phone's menu. */
export function MailboxLink({ className = QUIET, icon }: { className?: string; icon?: ReactNode }) {
  return (
    <Link to="/mailbox" className={className}>
      {icon}
      Test mailbox
    </Link>
  );
}
