import type { LibraryListParams, SitesListParams, StringsListParams } from '../lib/list-params';

/** Filters of a "every string of the site" fetch (sizing summary, label sheet). */
export type AllStringsFilter = { sizing?: 'fail'; inverterId?: number };

/**
 * Query keys of the asset registry, from one place. Everything about a site sits under
 * `assetKeys.site(id)`'s parent `sites()`, so an import invalidates lists, counts and strings at once.
 */
export const assetKeys = {
  all: ['assets'] as const,
  sites: () => [...assetKeys.all, 'sites'] as const,
  siteLists: () => [...assetKeys.sites(), 'list'] as const,
  siteList: (params: SitesListParams) => [...assetKeys.siteLists(), params] as const,
  site: (siteId: number) => [...assetKeys.sites(), 'detail', siteId] as const,
  siteStrings: (siteId: number) => [...assetKeys.site(siteId), 'strings'] as const,
  siteStringList: (siteId: number, params: StringsListParams) => [...assetKeys.siteStrings(siteId), 'page', params] as const,
  siteAllStrings: (siteId: number, filter: AllStringsFilter) => [...assetKeys.siteStrings(siteId), 'all', filter] as const,
  inverters: (siteId: number) => [...assetKeys.site(siteId), 'inverters'] as const,
  combinerBoxes: (siteId: number) => [...assetKeys.site(siteId), 'combiner-boxes'] as const,
  strings: () => [...assetKeys.all, 'strings'] as const,
  string: (stringId: number) => [...assetKeys.strings(), stringId] as const,
  moduleModels: () => [...assetKeys.all, 'module-models'] as const,
  moduleModelList: (params: LibraryListParams) => [...assetKeys.moduleModels(), params] as const,
  inverterModels: () => [...assetKeys.all, 'inverter-models'] as const,
  inverterModelList: (params: LibraryListParams) => [...assetKeys.inverterModels(), params] as const,
};
