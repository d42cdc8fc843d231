import { infiniteQueryOptions } from '@tanstack/react-query';
import { auditPageSchema, type AuditQuery } from '@shared/schemas/audit-log';
import { api } from '../../../lib/api-client';

export type AuditFilters = Omit<AuditQuery, 'beforeId'>;

export const auditKeys = { all: ['audit'] as const, list: (stationId: number, f: AuditFilters) => [...auditKeys.all, stationId, f] as const };

export const auditSearch = (f: AuditFilters) => new URLSearchParams(Object.entries(f).filter(([, v]) => v !== undefined && v !== '').map(([k, v]) => [k, String(v)])).toString();

export const auditCsvUrl = (stationId: number, f: AuditFilters) => `/api/stations/${stationId}/audit.csv?${auditSearch(f)}`;

export const auditQueryOptions = (stationId: number, f: AuditFilters) =>
  infiniteQueryOptions({
    queryKey: auditKeys.list(stationId, f),
    initialPageParam: null as string | null,
    queryFn: ({ pageParam, signal }) => {
      const q = auditSearch(f);
      return api.get(`/stations/${stationId}/audit?${q}${pageParam ? `${q ? '&' : ''}beforeId=${pageParam}` : ''}`, auditPageSchema, signal);
    },
    getNextPageParam: (last) => last.nextBeforeId,
  });
