import type { WorkOrderListParams } from '../lib/list-params';

export type SiteStringsParams = { q: string; page: number; pageSize: number };

/**
 * Query keys for work orders, from one place. Every ticket mutation invalidates `lists()` (the board
 * and My work) and refreshes `detail(id)`; technicians' open counts follow an assignment.
 */
export const workOrderKeys = {
  all: ['work-orders'] as const,
  lists: () => [...workOrderKeys.all, 'list'] as const,
  list: (params: WorkOrderListParams) => [...workOrderKeys.lists(), params] as const,
  mine: () => [...workOrderKeys.lists(), 'mine'] as const,
  details: () => [...workOrderKeys.all, 'detail'] as const,
  detail: (id: number) => [...workOrderKeys.details(), id] as const,
  technicians: () => [...workOrderKeys.all, 'technicians'] as const,
  sites: () => [...workOrderKeys.all, 'sites'] as const,
  siteStrings: (siteId: number, params: SiteStringsParams) =>
    [...workOrderKeys.all, 'site-strings', siteId, params] as const,
  sla: (siteId: number) => [...workOrderKeys.all, 'sla', siteId] as const,
  mailPreferences: () => [...workOrderKeys.all, 'mail-preferences'] as const,
};
