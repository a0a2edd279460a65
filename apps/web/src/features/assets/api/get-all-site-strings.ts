import type { PvString } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { assetKeys, type AllStringsFilter } from './keys';
import { stringsPageSchema } from './get-site-strings';

/** The API pages at most 200 strings; a plant of 600 takes three calls. */
const PAGE_SIZE = 200;
/** Enough for 20 000 strings; stops a runaway loop if totals ever disagree. */
const MAX_PAGES = 100;

/** Every string of a site matching the filter, page after page (for the sizing summary and labels). */
export async function getAllSiteStrings(siteId: number, filter: AllStringsFilter, signal?: AbortSignal): Promise<{ items: PvString[]; total: number }> {
  const items: PvString[] = [];
  let total = 0;
  for (let page = 1; page <= MAX_PAGES; page += 1) {
    const result = await api.get(`/api/sites/${siteId}/strings`, stringsPageSchema, {
      signal,
      query: { sizing: filter.sizing, inverterId: filter.inverterId, sort: 'inverter', page, pageSize: PAGE_SIZE },
    });
    items.push(...result.items);
    total = result.total;
    if (items.length >= total || result.items.length === 0) break;
  }
  return { items, total };
}

export const allSiteStringsQueryOptions = (siteId: number, filter: AllStringsFilter) =>
  queryOptions({
    queryKey: assetKeys.siteAllStrings(siteId, filter),
    queryFn: ({ signal }) => getAllSiteStrings(siteId, filter, signal),
  });

export function useAllSiteStrings(siteId: number, filter: AllStringsFilter, options: { enabled?: boolean } = {}) {
  return useQuery({ ...allSiteStringsQueryOptions(siteId, filter), enabled: options.enabled ?? true });
}
