import { useState } from 'react';
import { CalendarPlus, Copy, RefreshCw, Unlink } from 'lucide-react';
import type { CalendarFeedDto } from '#shared/schemas/calendar';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { mutationProblem } from '@/lib/problems';
import { useReplaceCalendarFeed, useRevokeCalendarFeed, useShowCalendarFeed } from '@/features/calendar/api/calendar-feed';

type Asking = 'replace' | 'revoke' | null;

/**
 * The grower's private calendar link: likely harvest windows and open alerts of every garden
 * they belong to, for a calendar app to subscribe to. Shown on request, copied, replaced or
 * stopped (both after asking).
 */
export function CalendarFeedSection() {
  const show = useShowCalendarFeed();
  const replace = useReplaceCalendarFeed();
  const revoke = useRevokeCalendarFeed();
  const [feed, setFeed] = useState<CalendarFeedDto | null>(null);
  const [asking, setAsking] = useState<Asking>(null);
  const [copied, setCopied] = useState<'yes' | 'no' | null>(null);
  const [stopped, setStopped] = useState(false);
  const failed = show.error ?? replace.error ?? revoke.error;

  const reset = () => {
    show.reset();
    replace.reset();
    revoke.reset();
    setCopied(null);
    setStopped(false);
  };
  const onShow = () => {
    reset();
    show.mutate(undefined, { onSuccess: setFeed });
  };
  const onReplace = () => {
    reset();
    replace.mutate(undefined, {
      onSuccess: (f) => {
        setFeed(f);
        setAsking(null);
      },
    });
  };
  const onRevoke = () => {
    reset();
    revoke.mutate(undefined, {
      onSuccess: () => {
        setFeed(null);
        setAsking(null);
        setStopped(true);
      },
    });
  };
  const onCopy = async () => {
    if (!feed?.url) return;
    try {
      await navigator.clipboard.writeText(feed.url);
      setCopied('yes');
    } catch {
      setCopied('no');
    }
  };

  return (
    <section id="calendar" aria-labelledby="calendar-heading" className="flex flex-col gap-4 rounded-lg border border-line bg-paper-raised p-4 sm:p-6">
      <h2 id="calendar-heading" className="text-xl font-bold">
        Add your harvest dates to a calendar app
      </h2>
      <p>
        A calendar app can subscribe to a private link that lists, for every garden you belong to, when each planting is likely ready to harvest and the
        alerts that are open. The dates move by themselves as the weather changes the forecast.
      </p>
      <p id="calendar-private" className="text-sm text-loam-soft">
        The link is yours alone and needs no password: anyone who has it can see the crops, beds and garden names in it. Keep it to yourself. If it gets out,
        make a new link — the old one stops working at once.
      </p>

      {failed && (
        <Notice tone="error" title="That did not work" live="alert">
          {mutationProblem(failed, 'nothing changed')}
        </Notice>
      )}
      {stopped && (
        <Notice tone="success" title="Link stopped" live="status">
          Calendar apps that used it get nothing more from Heatclock. You can make a new link at any time.
        </Notice>
      )}

      {!feed && (
        <div>
          <Button onClick={onShow} disabled={show.isPending}>
            <CalendarPlus className="size-5" aria-hidden="true" />
            {show.isPending ? 'Getting your link…' : 'Show my calendar link'}
          </Button>
        </div>
      )}

      {feed && (
        <div className="flex flex-col gap-3">
          {feed.url ? (
            <>
              <label htmlFor="calendar-url" className="font-semibold">
                Your calendar link
              </label>
              <p id="calendar-url-hint" className="text-sm text-loam-soft">
                In your calendar app, choose to add a calendar from a web address (it may be called “subscribe” or “from URL”) and paste this link.
              </p>
              <input
                id="calendar-url"
                readOnly
                value={feed.url}
                aria-describedby="calendar-url-hint calendar-private"
                onFocus={(e) => e.currentTarget.select()}
                className="min-h-11 w-full rounded-md border border-line bg-paper px-3 font-mono text-sm"
              />
              <div className="flex flex-wrap items-center gap-3">
                <Button variant="quiet" onClick={() => void onCopy()}>
                  <Copy className="size-5" aria-hidden="true" />
                  Copy link
                </Button>
                <p role="status" className={copied === 'no' ? 'text-clay' : 'text-leaf'}>
                  {copied === 'yes' && 'Link copied.'}
                  {copied === 'no' && 'Could not copy here: select the link and copy it yourself.'}
                </p>
              </div>
            </>
          ) : (
            <Notice tone="info" title="This link can no longer be shown">
              It still works in any calendar app that has it. To see a link again, make a new one; the old one then stops working.
            </Notice>
          )}

          {asking === 'replace' ? (
            <div role="group" aria-label="Make a new calendar link?" className="flex flex-col gap-2 rounded-md border-2 border-loam p-3">
              <p className="font-semibold">Make a new calendar link?</p>
              <p className="text-sm">The current link stops working at once: calendar apps that use it need the new one.</p>
              <div className="flex flex-wrap gap-2">
                <Button onClick={onReplace} disabled={replace.isPending}>
                  {replace.isPending ? 'Making a new link…' : 'Make a new link'}
                </Button>
                <Button variant="quiet" onClick={() => setAsking(null)} disabled={replace.isPending}>
                  Keep this link
                </Button>
              </div>
            </div>
          ) : asking === 'revoke' ? (
            <div role="group" aria-label="Stop this calendar link?" className="flex flex-col gap-2 rounded-md border-2 border-clay bg-clay-tint p-3">
              <p className="font-semibold">Stop this calendar link?</p>
              <p className="text-sm">Calendar apps that use it get nothing more from Heatclock. The events they already show may stay until they next refresh.</p>
              <div className="flex flex-wrap gap-2">
                <Button variant="danger" onClick={onRevoke} disabled={revoke.isPending}>
                  <Unlink className="size-5" aria-hidden="true" />
                  {revoke.isPending ? 'Stopping…' : 'Stop the link'}
                </Button>
                <Button variant="quiet" onClick={() => setAsking(null)} disabled={revoke.isPending}>
                  Keep it
                </Button>
              </div>
            </div>
          ) : (
            <div className="flex flex-wrap gap-2">
              <Button variant="quiet" onClick={() => setAsking('replace')}>
                <RefreshCw className="size-5" aria-hidden="true" />
                Make a new link
              </Button>
              <Button variant="quiet-danger" onClick={() => setAsking('revoke')}>
                <Unlink className="size-5" aria-hidden="true" />
                Stop this link
              </Button>
            </div>
          )}
        </div>
      )}
    </section>
  );
}
