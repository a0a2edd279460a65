/**
 * The pages a crew opens first (a bookmark, a link in a message): their code starts downloading as the
 * app's own script starts, alongside it, instead of once the router is up and asks for it. The router's
 * lazy() for the route then gets the same module, already there or on its way. Any other page loads
 * when the router asks, as before.
 */
const firstPages: ReadonlyArray<readonly [RegExp, () => Promise<unknown>]> = [
  [/^\/$/, () => import('./routes/home')],
  [/^\/sign-in\/?$/, () => import('./routes/sign-in')],
  [/^\/work-orders\/?$/, () => import('./routes/work-orders')],
  [/^\/work-orders\/[^/]+\/field\/?$/, () => import('./routes/field-checks')],
];

export function preloadFirstPage(pathname: string): void {
  const page = firstPages.find(([pattern]) => pattern.test(pathname));
  // A failed download is reported by the router, which asks for the same module.
  page?.[1]().catch(() => undefined);
}
