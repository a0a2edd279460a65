import {
  faultCategorySchema,
  openStatuses,
  pageQuerySchema,
  priorities,
  prioritySchema,
  workOrderListQuerySchema,
  workOrderStatuses,
  workOrderStatusSchema,
  type FaultCategory,
  type Priority,
  type Role,
  type WorkOrderStatus,
} from '@stringfield/shared';
import type { SortingState } from '@tanstack/react-table';
import type { z } from 'zod';

export type WorkOrderSort = z.output<typeof workOrderListQuerySchema.shape.sort>;
export type AssigneeFilter = 'me' | 'none' | number | undefined;

/** The board as the URL describes it: what `GET /api/work-orders` is asked for. */
export type WorkOrderListParams = {
  /** Empty means every status. */
  status: WorkOrderStatus[];
  priority: Priority[];
  siteId: number | undefined;
  assigneeId: AssigneeFilter;
  faultCategory: FaultCategory | undefined;
  isOverdueOnly: boolean;
  q: string;
  sort: WorkOrderSort;
  page: number;
  pageSize: number;
};

/**
 * Where the board starts. Everyone but owners starts on the open tickets, soonest deadline first;
 * owners only ever see signed-off tickets (the API filters), so they start on every status.
 */
export function defaultWorkOrderListParams(role?: Role): WorkOrderListParams {
  return {
    status: role === 'owner' ? [] : [...openStatuses],
    priority: [],
    siteId: undefined,
    assigneeId: undefined,
    faultCategory: undefined,
    isOverdueOnly: false,
    q: '',
    sort: role === 'owner' ? '-reportedAt' : 'dueAt',
    page: 1,
    pageSize: 25,
  };
}

/** `status=all` in the URL says "every status" when the default would be narrower. */
const ALL = 'all';

function sameSet<T>(a: readonly T[], b: readonly T[]): boolean {
  return a.length === b.length && a.every((x) => b.includes(x));
}

function listOf<T extends string>(
  raw: string | null,
  item: { safeParse: (v: unknown) => { success: boolean; data?: T } },
  order: readonly T[],
): T[] | undefined {
  if (raw === null) return undefined;
  const values = raw
    .split(',')
    .map((v) => item.safeParse(v.trim()))
    .filter((r) => r.success)
    .map((r) => r.data as T);
  const unique = order.filter((o) => values.includes(o));
  return unique.length ? unique : undefined;
}

/**
 * Reads the board's state from the address bar. A hand-edited or stale link never breaks the page:
 * each value that does not parse falls back to its default on its own.
 */
export function parseWorkOrderListParams(search: URLSearchParams, role?: Role): WorkOrderListParams {
  const d = defaultWorkOrderListParams(role);
  const shape = workOrderListQuerySchema.shape;
  const value = (key: string) => search.get(key) ?? undefined;
  const rawStatus = search.get('status');
  const status =
    rawStatus === ALL ? [] : (listOf(rawStatus, workOrderStatusSchema, workOrderStatuses) ?? d.status);
  const priority = listOf(search.get('priority'), prioritySchema, priorities) ?? d.priority;
  const siteId = shape.siteId.safeParse(value('siteId'));
  const assignee = shape.assigneeId.safeParse(value('assigneeId'));
  const fault = faultCategorySchema.safeParse(value('faultCategory'));
  const q = shape.q.safeParse(value('q'));
  const sort = shape.sort.safeParse(value('sort'));
  const page = pageQuerySchema.shape.page.safeParse(value('page'));
  const pageSize = pageQuerySchema.shape.pageSize.safeParse(value('pageSize'));
  return {
    status,
    priority,
    siteId: siteId.success ? siteId.data : undefined,
    assigneeId: assignee.success ? assignee.data : undefined,
    faultCategory: fault.success ? fault.data : undefined,
    isOverdueOnly: search.get('overdue') === 'true',
    q: (q.success ? q.data : undefined) ?? '',
    sort: sort.success && search.has('sort') ? sort.data : d.sort,
    page: page.success ? page.data : d.page,
    pageSize: pageSize.success ? pageSize.data : d.pageSize,
  };
}

/** The URL search for a board state, leaving defaults out so bookmarks stay short. */
export function workOrderListSearch(
  params: WorkOrderListParams,
  role?: Role,
): Record<string, string | number | undefined> {
  const d = defaultWorkOrderListParams(role);
  const status = sameSet(params.status, d.status)
    ? undefined
    : params.status.length === 0
      ? ALL
      : workOrderStatuses.filter((s) => params.status.includes(s)).join(',');
  return {
    status,
    priority: params.priority.length
      ? priorities.filter((p) => params.priority.includes(p)).join(',')
      : undefined,
    siteId: params.siteId,
    assigneeId: params.assigneeId,
    faultCategory: params.faultCategory,
    overdue: params.isOverdueOnly ? 'true' : undefined,
    q: params.q.trim() || undefined,
    sort: params.sort === d.sort ? undefined : params.sort,
    page: params.page === d.page ? undefined : params.page,
    pageSize: params.pageSize === d.pageSize ? undefined : params.pageSize,
  };
}

/** The query string `GET /api/work-orders` expects for a board state. */
export function workOrderListQuery(params: WorkOrderListParams): Record<string, string | number | undefined> {
  return {
    status: params.status.length ? params.status.join(',') : undefined,
    priority: params.priority.length ? params.priority.join(',') : undefined,
    siteId: params.siteId,
    assigneeId: params.assigneeId,
    faultCategory: params.faultCategory,
    overdue: params.isOverdueOnly ? 'true' : undefined,
    q: params.q.trim() || undefined,
    sort: params.sort,
    page: params.page,
    pageSize: params.pageSize,
  };
}

/** Whether anything narrows the board beyond where it starts (for "Clear filters" and the empty state). */
export function hasWorkOrderFilters(params: WorkOrderListParams, role?: Role): boolean {
  const d = defaultWorkOrderListParams(role);
  return (
    !sameSet(params.status, d.status) ||
    params.priority.length > 0 ||
    params.siteId !== undefined ||
    params.assigneeId !== undefined ||
    params.faultCategory !== undefined ||
    params.isOverdueOnly ||
    params.q.trim() !== ''
  );
}

/** The board's columns the server can sort by, keyed by column id. */
export const sortableColumns = ['number', 'priority', 'status', 'dueAt', 'reportedAt'] as const;

/** `-dueAt` → TanStack sorting state `[{ id: 'dueAt', desc: true }]`. */
export function sortingFromParam(sort: WorkOrderSort): SortingState {
  const desc = sort.startsWith('-');
  return [{ id: desc ? sort.slice(1) : sort, desc }];
}

/** TanStack sorting state → the API's `sort` value; unknown columns fall back to the deadline. */
export function sortParamFromSorting(sorting: SortingState): WorkOrderSort {
  const first = sorting[0];
  if (!first) return 'dueAt';
  const parsed = workOrderListQuerySchema.shape.sort.safeParse(`${first.desc ? '-' : ''}${first.id}`);
  return parsed.success ? parsed.data : 'dueAt';
}
