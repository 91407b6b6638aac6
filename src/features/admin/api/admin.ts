import { infiniteQueryOptions, queryOptions, useInfiniteQuery, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { AuditPageDto, CaughtMailListDto, OutboxMailDto } from '@shared/schemas/library';
import type { ItemsDto } from '@shared/schemas/responses';

export const AUDIT_PAGE_SIZE = 50;

export interface AuditFilters {
  entityType?: string;
  entityId?: string;
}

export const auditKeys = {
  all: ['audit'] as const,
  list: (filters: AuditFilters) => [...auditKeys.all, 'list', filters] as const,
};

export const mailKeys = {
  all: ['caught-mail'] as const,
  list: () => [...mailKeys.all, 'list'] as const,
  outbox: () => ['outbox', 'list'] as const,
};

/** Newest first; each further page asks for entries older than the last one shown. */
export const auditQueryOptions = (filters: AuditFilters) =>
  infiniteQueryOptions({
    queryKey: auditKeys.list(filters),
    queryFn: ({ pageParam }) => api.get<AuditPageDto>('/admin/audit', { ...filters, limit: AUDIT_PAGE_SIZE, before: pageParam }),
    initialPageParam: undefined as number | undefined,
    getNextPageParam: (last) => (last.items.length < AUDIT_PAGE_SIZE ? undefined : last.items[last.items.length - 1]?.id),
    staleTime: 0,
  });

export const useAuditLog = (filters: AuditFilters) => useInfiniteQuery(auditQueryOptions(filters));

export const caughtMailQueryOptions = () =>
  queryOptions({ queryKey: mailKeys.list(), queryFn: () => api.get<CaughtMailListDto>('/admin/mail'), staleTime: 0 });

export const useCaughtMail = () => useQuery(caughtMailQueryOptions());

export const outboxQueryOptions = () =>
  queryOptions({ queryKey: mailKeys.outbox(), queryFn: () => api.get<ItemsDto<OutboxMailDto>>('/admin/outbox').then((r) => r.items), staleTime: 0 });

export const useOutbox = () => useQuery(outboxQueryOptions());
