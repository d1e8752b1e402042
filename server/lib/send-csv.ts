import type { Response } from 'express';

/** A CSV download: UTF-8 text, a file name to save it under, never sniffed as anything else. */
export function sendCsv(res: Response, filename: string, csv: string): void {
  res.set({
    'Content-Type': 'text/csv; charset=utf-8',
    'Content-Disposition': `attachment; filename="${filename.replace(/[^\w.-]/g, '-')}"`,
    'X-Content-Type-Options': 'nosniff',
  });
  res.send(csv);
}
