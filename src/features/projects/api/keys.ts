import { queryKeys } from '@/lib/query-keys';

/** Query keys of the projects feature: one factory per kind of data. */
export const projectKeys = {
  all: ['projects'] as const,
  list: () => [...projectKeys.all, 'list'] as const,
  /** Prefix of everything about one project (its load cases, shortlists and records too). */
  detail: (id: number) => [...projectKeys.all, 'detail', id] as const,
  loadCases: (id: number) => [...projectKeys.detail(id), 'load-cases'] as const,
  shortlists: (id: number) => [...projectKeys.detail(id), 'shortlists'] as const,
  records: (id: number) => [...projectKeys.detail(id), 'records'] as const,
};

export const shortlistKeys = {
  ...queryKeys('shortlists'),
  /** Shortlists waiting for the signed-in checker. */
  awaitingCheck: () => [...shortlistKeys.all, 'awaiting-check'] as const,
};

export const recordKeys = queryKeys('design-records');

export const peopleKeys = {
  all: ['people'] as const,
  list: () => [...peopleKeys.all, 'list'] as const,
};
