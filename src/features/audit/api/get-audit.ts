import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditPageDto } from '#shared/schemas/audit';
import { api } from '@/lib/api-client';
import { auditSearchParams } from '@/features/audit/utils/audit-search';
import type { AuditQuery } from '@/features/audit/utils/audit-search';

export const auditKeys = {
  all: (gardenId: number) => ['audit', gardenId] as const,
  list: (gardenId: number, query: AuditQuery) => ['audit', gardenId, 'list', query] as const,
};

export function getAudit(gardenId: number, query: AuditQuery, signal?: AbortSignal): Promise<AuditPageDto> {
  const params = auditSearchParams(query);
  const search = params.size ? `?${params}` : '';
  return api.get<AuditPageDto>(`/api/gardens/${gardenId}/audit${search}`, signal);
}

export const auditQueryOptions = (gardenId: number, query: AuditQuery) =>
  queryOptions({
    queryKey: auditKeys.list(gardenId, query),
    queryFn: ({ signal }) => getAudit(gardenId, query, signal),
    // Keeps the page in place while the next one or another filter loads.
    placeholderData: keepPreviousData,
    // Any change anywhere in the garden adds an entry: read afresh each time the page opens.
    staleTime: 0,
  });

/** Only owners may read the trail; for anyone else nothing is asked. */
export function useAudit(gardenId: number, query: AuditQuery, enabled: boolean) {
  return useQuery({ ...auditQueryOptions(gardenId, query), enabled });
}
