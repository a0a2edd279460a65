import type { SessionUser } from '@stringfield/shared';
import { authKeys } from '@/features/auth/api/keys';
import { nextTask } from '@/lib/after-load';
import { peekEarly } from '@/lib/early-answers';
import { warmUpIntl } from '@/lib/warm-up-intl';

/** Where the first page was opened: the path and the query string. */
export type FirstLocation = { pathname: string; search: string };

/**
 * A first page's module. `startFirstAnswers`, when it has one, asks for the page's data as soon as its
 * code and the signed-in person are known (see lib/early-answers), instead of once React has rendered
 * the page and its queries mount.
 */
type FirstPageModule = { startFirstAnswers?: (user: SessionUser, location: FirstLocation) => void };

/**
 * The pages a crew opens first (a bookmark, a link in a message): their code starts downloading as the
 * app's own script starts, alongside it, instead of once the router is up and asks for it. The router's
 * lazy() for the route then gets the same module, already there or on its way. Any other page loads
 * when the router asks, as before.
 */
const firstPages: ReadonlyArray<readonly [RegExp, () => Promise<object>]> = [
  [/^\/$/, () => import('./routes/home')],
  [/^\/sign-in\/?$/, () => import('./routes/sign-in')],
  [/^\/work-orders\/?$/, () => import('./routes/work-orders')],
  [/^\/work-orders\/[^/]+\/field\/?$/, () => import('./routes/field-checks')],
];

/**
 * First pages that draw tickets: their first render formats dates and numbers (deadlines, readings; see
 * lib/warm-up-intl), and their code builds on the tickets' common modules (records, keys, deadlines: the
 * `tickets` chunk of vite.config.ts).
 */
const drawsTickets = [/^\/$/, /^\/work-orders\/?$/, /^\/work-orders\/[^/]+\/field\/?$/];

/**
 * Starts loading the first page's code, and asks for its data (`startFirstAnswers`) once the code and the
 * signed-in person are there. Building a page's modules is start-up's longest piece of script, so it is cut
 * in tasks of its own: the tickets' common modules first, then the page's own, then the requests.
 */
export function preloadFirstPage(location: FirstLocation): void {
  const page = firstPages.find(([pattern]) => pattern.test(location.pathname));
  if (!page) return;
  const me = peekEarly<SessionUser | null>(authKeys.me()) ?? Promise.resolve(null);
  const common = drawsTickets.some((pattern) => pattern.test(location.pathname))
    ? import('@/features/work-orders/api/keys').then(nextTask)
    : Promise.resolve();
  // A failed download is reported by the router, which asks for the same module; a failed answer by
  // the query that takes it over.
  Promise.all([common.then(page[1]), me])
    .then(async ([module, user]) => {
      await nextTask();
      if (user) (module as FirstPageModule).startFirstAnswers?.(user, location);
    })
    .catch(() => undefined);
}

/**
 * For a first page that formats dates or numbers as it draws: the browser's locale data, loaded now (its
 * own task, in main.tsx's start-up) rather than in the middle of that page's first render.
 */
export function prepareFirstPage(location: FirstLocation): void {
  if (drawsTickets.some((pattern) => pattern.test(location.pathname))) warmUpIntl();
}
