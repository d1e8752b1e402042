import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';

const QUIET = 'inline-flex min-h-11 items-center text-sm text-loam-soft underline underline-offset-2 hover:text-loam';

/** The account page, beside the name and "Sign out" in the header or the phone's menu. */
export function AccountLink({ className = QUIET, icon }: { className?: string; icon?: ReactNode }) {
  return (
    <Link to="/account" className={className}>
      {icon}
      Account
    </Link>
  );
}
