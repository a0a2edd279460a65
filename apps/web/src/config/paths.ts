/**
 * Route patterns (for the router) and typed builders (for links). Every in-app URL is made here,
 * so a renamed route is one edit and a link can't drift from its route.
 */
export const routes = {
  home: '/',
  signIn: '/sign-in',
  forgotPassword: '/forgot-password',
  resetPassword: '/reset-password',
  people: '/people',
  outbox: '/outbox',
  outboxMessage: '/outbox/:messageId',
  sites: '/sites',
  datasheets: '/datasheets',
  site: '/sites/:siteId',
  siteImport: '/sites/:siteId/import',
  siteLabels: '/sites/:siteId/labels',
  string: '/strings/:stringId',
  moduleModels: '/datasheets/modules',
  inverterModels: '/datasheets/inverters',
  workOrders: '/work-orders',
  newWorkOrder: '/work-orders/new',
  workOrder: '/work-orders/:workOrderId',
  fieldChecks: '/work-orders/:workOrderId/field',
  instruments: '/instruments',
  reports: '/reports',
  settings: '/settings',
  fleet: '/fleet',
  fleetSite: '/fleet/sites/:siteId',
  fleetMetrics: '/fleet/metrics',
  fleetEnergy: '/fleet/energy',
  fleetExports: '/fleet/exports',
} as const;

type SearchValue = string | number | boolean | null | undefined;

/** Builds `?a=1&b=2` from an object, leaving out empty values; returns '' when nothing is left. */
export function toSearch(params: Record<string, SearchValue>): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value === undefined || value === null || value === '' || value === false) continue;
    search.set(key, String(value));
  }
  const text = search.toString();
  return text ? `?${text}` : '';
}

/**
 * Accepts a `?next=` target only if it stays inside this app: a path starting with a single `/`.
 * Anything else (absolute URLs, `//evil.example`, `/\evil`, the auth pages themselves) falls back home,
 * so a crafted sign-in link can't bounce a technician to another site.
 */
export function safeNext(next: string | null | undefined): string {
  if (!next) return routes.home;
  if (!next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return routes.home;
  if ([...next].some((ch) => ch.charCodeAt(0) < 0x20 || ch === '\\')) return routes.home;
  const pathname = next.split(/[?#]/)[0] ?? '';
  const authPages: string[] = [routes.signIn, routes.forgotPassword, routes.resetPassword];
  if (authPages.includes(pathname)) return routes.home;
  return next;
}

export const paths = {
  home: () => routes.home,
  /** Sign-in page; `next` is where to go afterwards (path + search + hash of the page asked for). */
  signIn: (next?: string) => {
    const target = next ? safeNext(next) : routes.home;
    return `${routes.signIn}${toSearch({ next: target === routes.home ? undefined : target })}`;
  },
  forgotPassword: () => routes.forgotPassword,
  resetPassword: (token: string, options: { isInvite?: boolean } = {}) =>
    `${routes.resetPassword}${toSearch({ token, invite: options.isInvite ? 1 : undefined })}`,
  people: (search: Record<string, SearchValue> = {}) => `${routes.people}${toSearch(search)}`,
  outbox: (search: { page?: number } = {}) => `${routes.outbox}${toSearch({ page: search.page === 1 ? undefined : search.page })}`,
  outboxMessage: (messageId: string, search: { page?: number } = {}) =>
    `${routes.outbox}/${encodeURIComponent(messageId)}${toSearch({ page: search.page === 1 ? undefined : search.page })}`,
  sites: (search: Record<string, SearchValue> = {}) => `${routes.sites}${toSearch(search)}`,
  site: (siteId: number, search: Record<string, SearchValue> = {}) => `${routes.sites}/${siteId}${toSearch(search)}`,
  datasheets: () => routes.datasheets,
  siteImport: (siteId: number) => `${routes.sites}/${siteId}/import`,
  siteLabels: (siteId: number, search: { inverterId?: number } = {}) => `${routes.sites}/${siteId}/labels${toSearch(search)}`,
  string: (stringId: number) => `/strings/${stringId}`,
  moduleModels: (search: Record<string, SearchValue> = {}) => `${routes.moduleModels}${toSearch(search)}`,
  inverterModels: (search: Record<string, SearchValue> = {}) => `${routes.inverterModels}${toSearch(search)}`,
  /** The board; `search` is the filter state as URL values (see work-orders list-params). */
  workOrders: (search: Record<string, SearchValue> = {}) => `${routes.workOrders}${toSearch(search)}`,
  workOrder: (workOrderId: number) => `${routes.workOrders}/${workOrderId}`,
  /** The technician's field page of a ticket; `stringId` opens that string's check. */
  fieldChecks: (workOrderId: number, search: { stringId?: number } = {}) =>
    `${routes.workOrders}/${workOrderId}/field${toSearch({ string: search.stringId })}`,
  instruments: () => routes.instruments,
  newWorkOrder: (search: { siteId?: number } = {}) => `${routes.newWorkOrder}${toSearch(search)}`,
  settings: () => routes.settings,
  /** Fleet overview: every visible site with its energy at risk. */
  fleet: () => routes.fleet,
  /** A site's string health map; `search` holds the map filters (see fleet map-params). */
  fleetSite: (siteId: number, search: Record<string, SearchValue> = {}) => `/fleet/sites/${siteId}${toSearch(search)}`,
  fleetMetrics: (search: Record<string, SearchValue> = {}) => `${routes.fleetMetrics}${toSearch(search)}`,
  fleetEnergy: (search: Record<string, SearchValue> = {}) => `${routes.fleetEnergy}${toSearch(search)}`,
  fleetExports: (search: Record<string, SearchValue> = {}) => `${routes.fleetExports}${toSearch(search)}`,
  /** The asset owner's close-out reports, per site; `page` pages each site's list. */
  reports: (search: { siteId?: number; page?: number } = {}) =>
    `${routes.reports}${toSearch({ siteId: search.siteId, page: search.page === 1 ? undefined : search.page })}`,
} as const;

/**
 * In-page anchors of the ticket page, so the sign-off checklist can point at the panel where a
 * missing item is fixed without the panels knowing each other.
 */
export const ticketAnchors = {
  string: (stringId: number) => `string-${stringId}`,
  gallery: 'evidence-gallery',
  upload: 'photo-upload',
  diodes: 'diode-records',
  diode: (diodeId: number) => `diode-${diodeId}`,
  signOff: 'sign-off',
  report: 'close-out-report',
} as const;
