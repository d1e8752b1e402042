import { MapPinOff } from 'lucide-react';
import { Link } from 'react-router-dom';

export function NotFoundMessage({ what = 'page' }: { what?: 'page' | 'garden' }) {
  return (
    <div className="flex flex-col items-start gap-3 py-6">
      <title>Not found · Heatclock</title>
      <MapPinOff className="size-10 text-loam-soft" aria-hidden="true" />
      <h1 className="text-2xl font-bold">{what === 'garden' ? 'Garden not found' : 'Page not found'}</h1>
      <p className="max-w-prose text-loam-soft">
        {what === 'garden'
          ? 'There is no garden at this address, or you are not one of its members. If you expected to see it, ask the garden’s owner to add you.'
          : 'Nothing grows at this address. The link may be mistyped or out of date.'}
      </p>
      <Link to="/" className="inline-flex min-h-11 items-center font-semibold text-frost underline">
        Go to your gardens
      </Link>
    </div>
  );
}
