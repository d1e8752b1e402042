import { ChevronLeft, ChevronRight } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { countOf } from '#shared/format/count-words';

/** "Changes 51–100 of 230" with Newer and Older. */
export function AuditPager({ page, pageSize, total, busy, onPage }: { page: number; pageSize: number; total: number; busy: boolean; onPage: (page: number) => void }) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <nav aria-label="Pages of changes" className="flex flex-wrap items-center gap-3">
      <Button variant="quiet" disabled={busy || page <= 1} onClick={() => onPage(page - 1)}>
        <ChevronLeft className="size-4" aria-hidden="true" />
        Newer
      </Button>
      <p aria-live="polite">{total > pageSize ? `Changes ${first}–${last} of ${total}` : countOf(total, 'change')}</p>
      <Button variant="quiet" disabled={busy || page >= pages} onClick={() => onPage(page + 1)}>
        Older
        <ChevronRight className="size-4" aria-hidden="true" />
      </Button>
    </nav>
  );
}
