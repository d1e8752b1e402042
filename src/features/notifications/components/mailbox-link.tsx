import { Link } from 'react-router-dom';

/** A quiet link to the local test mailbox, for the account area of the header. */
export function MailboxLink() {
  return (
    <Link to="/mailbox" className="text-sm text-loam-soft underline underline-offset-2 hover:text-loam">
      Test mailbox
    </Link>
  );
}
