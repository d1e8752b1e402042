import type { ApiRowProblem } from '@/lib/api-client';

/** The rows of an uploaded file the server could not accept, with what to fix in each. */
export function RowReport({ rows }: { rows: ApiRowProblem[] }) {
  return (
    <div className="mt-2 overflow-x-auto rounded-md border border-line bg-paper-raised" tabIndex={0} role="region" aria-label="Rows to fix">
      <table className="w-full border-collapse text-sm">
        <thead>
          <tr className="border-b border-line text-left">
            <th scope="col" className="px-3 py-1.5">Line</th>
            <th scope="col" className="px-3 py-1.5">Column</th>
            <th scope="col" className="px-3 py-1.5">What to fix</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row, k) => (
            <tr key={`${row.line}-${row.column ?? ''}-${k}`} className="border-b border-line/60 last:border-b-0">
              <td className="px-3 py-1.5 tabular-nums">{row.line}</td>
              <td className="px-3 py-1.5">{row.column ?? 'whole row'}</td>
              <td className="px-3 py-1.5">{row.message}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
