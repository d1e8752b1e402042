import type { AlertListQuery } from '#shared/schemas/alerts';

/** `?status=open&type=frost` with only the filters that are set. */
export function alertSearchParams(query: AlertListQuery): URLSearchParams {
  const params = new URLSearchParams();
  if (query.status) params.set('status', query.status);
  if (query.type) params.set('type', query.type);
  if (query.limit) params.set('limit', String(query.limit));
  return params;
}
