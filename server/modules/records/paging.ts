import type { Page } from '#shared/schemas/records';

export function pageOf<T>(items: T[], total: number, q: { page: number; pageSize: number }): Page<T> {
  return { items, total, page: q.page, pageSize: q.pageSize };
}

export const limitOffset = (q: { page: number; pageSize: number }) => ({ limit: q.pageSize, offset: (q.page - 1) * q.pageSize });

/** Escapes LIKE wildcards so a search for "50%" means the text, not a pattern. */
export function likeText(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
