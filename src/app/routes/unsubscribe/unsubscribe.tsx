import { useParams } from 'react-router-dom';
import { Wordmark } from '@/components/ui/wordmark';
import { UnsubscribePanel } from '@/features/notifications/components/unsubscribe-panel';

export function UnsubscribePage() {
  const { token = '' } = useParams();
  return (
    <div className="mx-auto flex max-w-xl flex-col gap-6 px-4 py-10">
      <title>Stop e-mail · Heatclock</title>
      <Wordmark />
      <main id="main" className="flex flex-col gap-4">
        <h1 className="text-2xl font-bold">Stop e-mail from a garden</h1>
        <UnsubscribePanel token={token} />
      </main>
    </div>
  );
}
