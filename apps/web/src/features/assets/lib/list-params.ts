import { listQuerySchema, pageQuerySchema, stringListQuerySchema } from '@stringfield/shared';
import type { SortingState } from '@tanstack/react-table';
import type { z } from 'zod';

/* Each list's state lives in the address bar so a view can be linked. A hand-edited or stale link
   never breaks a page: every value that does not parse falls back to its own default. */

type SearchValue = string | number | undefined;

function read<T>(schema: z.ZodType<T>, value: string | null, fallback: T): T {
  if (value === null || value === '') return fallback;
  const parsed = schema.safeParse(value);
  return parsed.success && parsed.data !== undefined ? parsed.data : fallback;
}

const pageShape = pageQuerySchema.shape;

// ---------- Sites ----------
export const siteSorts = ['name', '-name', 'code', '-code'] as const;
export type SiteSort = (typeof siteSorts)[number];

export type SitesListParams = { q: string; sort: SiteSort; page: number; pageSize: number };
export const defaultSitesListParams: SitesListParams = { q: '', sort: 'name', page: 1, pageSize: 25 };

function isOneOf<T extends string>(options: readonly T[], value: string | null): value is T {
  return value !== null && (options as readonly string[]).includes(value);
}

export function parseSitesListParams(search: URLSearchParams): SitesListParams {
  const d = defaultSitesListParams;
  const sort = search.get('sort');
  return {
    q: read(listQuerySchema.shape.q, search.get('q'), undefined) ?? d.q,
    sort: isOneOf(siteSorts, sort) ? sort : d.sort,
    page: read(pageShape.page, search.get('page'), d.page),
    pageSize: read(pageShape.pageSize, search.get('pageSize'), d.pageSize),
  };
}

export function sitesListSearch(params: SitesListParams): Record<string, SearchValue> {
  const d = defaultSitesListParams;
  return {
    q: params.q.trim() || undefined,
    sort: params.sort === d.sort ? undefined : params.sort,
    page: params.page === d.page ? undefined : params.page,
    pageSize: params.pageSize === d.pageSize ? undefined : params.pageSize,
  };
}

// ---------- Strings of a site ----------
export type StringSort = z.output<typeof stringListQuerySchema.shape.sort>;
export type SizingFilter = z.output<typeof stringListQuerySchema.shape.sizing>;
export const stringSorts = stringListQuerySchema.shape.sort.unwrap().options;

export type StringsListParams = {
  q: string;
  inverterId: number | undefined;
  mpptInput: number | undefined;
  sizing: SizingFilter;
  sort: StringSort;
  page: number;
  pageSize: number;
};
export const defaultStringsListParams: StringsListParams = {
  q: '',
  inverterId: undefined,
  mpptInput: undefined,
  sizing: 'all',
  sort: 'inverter',
  page: 1,
  pageSize: 50,
};

export function parseStringsListParams(search: URLSearchParams): StringsListParams {
  const d = defaultStringsListParams;
  const shape = stringListQuerySchema.shape;
  return {
    q: read(shape.q, search.get('q'), undefined) ?? d.q,
    inverterId: read(shape.inverterId, search.get('inverterId'), undefined),
    mpptInput: read(shape.mpptInput, search.get('mpptInput'), undefined),
    sizing: read(shape.sizing, search.get('sizing'), d.sizing),
    sort: read(shape.sort, search.get('sort'), d.sort),
    page: read(pageShape.page, search.get('page'), d.page),
    pageSize: read(pageShape.pageSize, search.get('pageSize'), d.pageSize),
  };
}

export function stringsListSearch(params: StringsListParams): Record<string, SearchValue> {
  const d = defaultStringsListParams;
  return {
    q: params.q.trim() || undefined,
    inverterId: params.inverterId,
    mpptInput: params.mpptInput,
    sizing: params.sizing === d.sizing ? undefined : params.sizing,
    sort: params.sort === d.sort ? undefined : params.sort,
    page: params.page === d.page ? undefined : params.page,
    pageSize: params.pageSize === d.pageSize ? undefined : params.pageSize,
  };
}

// ---------- Datasheet libraries ----------
export type LibraryListParams = { q: string; includeArchived: boolean; page: number; pageSize: number };
export const defaultLibraryListParams: LibraryListParams = { q: '', includeArchived: false, page: 1, pageSize: 25 };

export function parseLibraryListParams(search: URLSearchParams): LibraryListParams {
  const d = defaultLibraryListParams;
  return {
    q: read(listQuerySchema.shape.q, search.get('q'), undefined) ?? d.q,
    includeArchived: search.get('archived') === 'true',
    page: read(pageShape.page, search.get('page'), d.page),
    pageSize: read(pageShape.pageSize, search.get('pageSize'), d.pageSize),
  };
}

export function libraryListSearch(params: LibraryListParams): Record<string, SearchValue> {
  const d = defaultLibraryListParams;
  return {
    q: params.q.trim() || undefined,
    archived: params.includeArchived ? 'true' : undefined,
    page: params.page === d.page ? undefined : params.page,
    pageSize: params.pageSize === d.pageSize ? undefined : params.pageSize,
  };
}

// ---------- Sorting state ↔ the API's `sort` value ----------
/** `-code` → TanStack sorting state `[{ id: 'code', desc: true }]`. */
export function sortingFromParam(sort: string): SortingState {
  const desc = sort.startsWith('-');
  return [{ id: desc ? sort.slice(1) : sort, desc }];
}

/** TanStack sorting state → one of the API's sort values; anything unknown falls back. */
export function sortParamFromSorting<T extends string>(sorting: SortingState, options: readonly T[], fallback: T): T {
  const first = sorting[0];
  if (!first) return fallback;
  const candidate = `${first.desc ? '-' : ''}${first.id}`;
  return isOneOf(options, candidate) ? candidate : fallback;
}
