import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client.ts';

export interface AuditEventDto {
  id: number;
  at: string;
  actorName: string;
  action: string;
  entityType: string;
  entityId: number | null;
  summary: string;
  before: unknown;
  after: unknown;
}

export interface AuditFilters {
  action?: string;
  entityType?: string;
  actor?: string;
}

export const auditKeys = {
  all: ['audit'] as const,
  list: (conversionId: number, filters: AuditFilters) =>
    [...auditKeys.all, conversionId, filters] as const,
};

export function getAudit(conversionId: number, filters: AuditFilters) {
  const params = new URLSearchParams(
    Object.entries(filters).filter(([, v]) => v) as Array<[string, string]>,
  );
  const query = params.size ? `?${params}` : '';
  return api
    .get<{ events: AuditEventDto[] }>(`/api/conversions/${conversionId}/audit${query}`)
    .then((r) => r.events);
}

export const getAuditQueryOptions = (conversionId: number, filters: AuditFilters) =>
  queryOptions({
    queryKey: auditKeys.list(conversionId, filters),
    queryFn: () => getAudit(conversionId, filters),
  });

export const useAudit = (conversionId: number, filters: AuditFilters) =>
  useQuery(getAuditQueryOptions(conversionId, filters));
