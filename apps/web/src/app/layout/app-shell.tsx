import { roleLabels, type SessionUser } from '@stringfield/shared';
import { useEffect, useRef, useState, type ReactNode } from 'react';
import { Link, useLocation } from 'react-router';
import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { Sheet } from '@/components/ui/sheet';
import { Wordmark } from '@/components/ui/wordmark';
import { paths } from '@/config/paths';
import { useSignOut } from '@/features/auth/api/sign-out';
import { cn } from '@/lib/cn';
import { isNavItemCurrent, navItemsFor, PHONE_TAB_LIMIT, PHONE_TAB_LIMIT_WIDE, phoneTabsFor, type NavItem } from '../nav';

/* The phone bar shows PHONE_TAB_LIMIT tabs and "More" below 480 px (four 90 px slots at 360 px) and
   one tab more from 480 px; both splits are rendered and CSS picks, so nothing jumps on load. */
const onlyWide = 'hidden min-[480px]:flex';
const onlyNarrow = 'min-[480px]:hidden';

/**
 * The signed-in frame. Phones get a compact brand header and, when a role has more than one place
 * to go, a bottom tab bar within thumb reach: the role's most used places as tabs and a "More" sheet
 * with the rest. From 1024 px a side rail with every item takes over. `notice` is a slim message
 * above the page (e.g. "offline — showing saved data").
 */
export function AppShell({ user, notice, children }: { user: SessionUser; notice?: ReactNode; children: ReactNode }) {
  const items = navItemsFor(user.role);
  const hasTabBar = items.length > 1;
  const narrow = phoneTabsFor(user.role, PHONE_TAB_LIMIT);
  const wide = phoneTabsFor(user.role, PHONE_TAB_LIMIT_WIDE);
  const [isMoreOpen, setIsMoreOpen] = useState(false);
  const signOut = useSignOut();
  const mainRef = useRef<HTMLElement>(null);
  const { pathname } = useLocation();
  const previousPath = useRef(pathname);

  // After an in-app navigation, move focus to the new page so screen readers start at its top.
  useEffect(() => {
    if (previousPath.current === pathname) return;
    previousPath.current = pathname;
    mainRef.current?.focus({ preventScroll: true });
  }, [pathname]);

  // The sheet belongs to the phone bar: close it when the window grows into the side-rail layout.
  useEffect(() => {
    const desktop = window.matchMedia('(min-width: 1024px)');
    const onChange = () => {
      if (desktop.matches) setIsMoreOpen(false);
    };
    desktop.addEventListener('change', onChange);
    return () => desktop.removeEventListener('change', onChange);
  }, []);

  // One rule for "you are here" in the rail, the tab bar and the More sheet (see isNavItemCurrent).
  const isCurrent = (item: NavItem) => isNavItemCurrent(item, pathname, user.role);
  const isInWideMore = wide.more.some(isCurrent);
  const currentInMore = narrow.more.find(isCurrent);
  // Below 480 px the current page may sit under More while it is a tab above; mark "More" accordingly.
  const moreTone = isInWideMore ? 'active' : currentInMore ? 'narrow' : 'none';

  const signOutButton = (className?: string) => (
    <Button
      variant="ghost"
      onClick={() => signOut.mutate()}
      isPending={signOut.isPending}
      className={cn('text-on-brand hover:bg-brand-strong active:bg-brand-strong', className)}
    >
      {signOut.isPending ? null : <Icon name="signOut" />}
      Sign out
    </Button>
  );

  return (
    <div className="min-h-dvh lg:pl-64">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:fixed focus:top-3 focus:left-3 focus:z-50 focus:rounded-control focus:bg-surface focus:px-4 focus:py-3 focus:font-semibold focus:text-ink focus:shadow-raised"
      >
        Skip to content
      </a>

      {/* Phone and tablet header */}
      <header className="on-brand sticky top-0 z-30 flex items-center justify-between gap-3 bg-brand px-3 py-1 text-on-brand shadow-card lg:hidden">
        <Link to={paths.home()} className="inline-flex min-h-touch items-center rounded-control px-1" aria-label="Stringfield, home">
          <Wordmark isCompact />
        </Link>
        <div className="flex min-w-0 items-center gap-1">
          <span className="hidden min-w-0 truncate text-sm text-on-brand-muted sm:block">
            {user.name} · {roleLabels[user.role]}
          </span>
          {signOutButton('px-3')}
        </div>
      </header>

      {/* Desktop side rail */}
      <aside className="on-brand fixed inset-y-0 left-0 z-30 hidden w-64 flex-col bg-brand text-on-brand lg:flex">
        <div className="px-6 pt-7 pb-8">
          <Link to={paths.home()} className="inline-flex rounded-control" aria-label="Stringfield, home">
            <Wordmark />
          </Link>
        </div>
        <nav aria-label="Main" className="flex-1 px-3">
          <ul className="flex flex-col gap-1">
            {items.map((item) => (
              <li key={item.to}>
                <Link
                  to={item.to}
                  aria-current={isCurrent(item) ? 'page' : undefined}
                  className={cn(
                    'flex min-h-touch items-center gap-3 rounded-control px-4 text-lg font-semibold transition-colors',
                    isCurrent(item) ? 'bg-paper text-brand' : 'text-on-brand hover:bg-brand-strong',
                  )}
                >
                  <Icon name={item.icon} className="size-6" />
                  {item.label}
                </Link>
              </li>
            ))}
          </ul>
        </nav>
        <div className="border-t border-on-brand/20 px-6 py-5">
          <p className="font-semibold">{user.name}</p>
          <p className="text-sm text-on-brand-muted">{roleLabels[user.role]}</p>
          <p className="truncate text-sm text-on-brand-muted" title={user.email}>
            {user.email}
          </p>
          {signOutButton('mt-3 -ml-4')}
        </div>
      </aside>

      <main
        id="main"
        ref={mainRef}
        tabIndex={-1}
        className={cn('mx-auto w-full max-w-6xl px-4 pt-5 pb-10 outline-none sm:px-6 lg:px-10 lg:pt-10', hasTabBar && 'pb-28 lg:pb-10')}
      >
        {notice ? <div className="mb-4 lg:mb-6">{notice}</div> : null}
        {children}
      </main>

      {hasTabBar ? (
        <nav aria-label="Main" className="fixed inset-x-0 bottom-0 z-30 border-t-2 border-line bg-surface pb-[env(safe-area-inset-bottom)] lg:hidden">
          <ul className="mx-auto flex max-w-xl">
            {wide.tabs.map((item) => (
              <li key={item.to} className={cn('flex-1', narrow.tabs.includes(item) ? 'flex' : onlyWide)}>
                <Link to={item.to} aria-current={isCurrent(item) ? 'page' : undefined} className={tabClasses(isCurrent(item) ? 'active' : 'none')}>
                  <TabContent item={item} tone={isCurrent(item) ? 'active' : 'none'} />
                </Link>
              </li>
            ))}
            {narrow.more.length > 0 ? (
              <li className={cn('flex flex-1', wide.more.length === 0 && onlyNarrow)}>
                <button
                  type="button"
                  aria-haspopup="dialog"
                  aria-expanded={isMoreOpen}
                  onClick={() => setIsMoreOpen(true)}
                  className={tabClasses(moreTone)}
                >
                  <TabContent item={{ label: 'More', icon: 'more' }} tone={moreTone} />
                  {currentInMore ? (
                    <span className={cn('sr-only', !isInWideMore && onlyNarrow)}>, current page: {currentInMore.label}</span>
                  ) : null}
                </button>
              </li>
            ) : null}
          </ul>
        </nav>
      ) : null}

      {narrow.more.length > 0 ? (
        <Sheet isOpen={isMoreOpen} onClose={() => setIsMoreOpen(false)} title="More" description={`${user.name} · ${roleLabels[user.role]}`}>
          <nav aria-label="More">
            <ul className="flex flex-col gap-1">
              {narrow.more.map((item) => (
                <li key={item.to} className={cn(!wide.more.includes(item) && onlyNarrow)}>
                  <Link
                    to={item.to}
                    aria-current={isCurrent(item) ? 'page' : undefined}
                    onClick={() => setIsMoreOpen(false)}
                    className={cn(
                      'relative flex min-h-14 items-center gap-3 rounded-control px-4 text-lg font-semibold transition-colors',
                      isCurrent(item) ? 'bg-brand-soft text-brand' : 'text-ink hover:bg-sunken active:bg-sunken',
                    )}
                  >
                    <span aria-hidden="true" className={cn('absolute inset-y-2 left-0 w-1 rounded-r-full', isCurrent(item) ? 'bg-copper-line' : 'bg-transparent')} />
                    <Icon name={item.icon} className="size-6" />
                    <span className="flex-1">{item.label}</span>
                    {isCurrent(item) ? (
                      <span className="flex items-center gap-1 text-sm font-semibold text-brand">
                        <Icon name="check" className="size-5" />
                        Current
                      </span>
                    ) : (
                      <Icon name="chevronRight" className="size-5 text-ink-muted" />
                    )}
                  </Link>
                </li>
              ))}
            </ul>
          </nav>
        </Sheet>
      ) : null}
    </div>
  );
}

type TabTone = 'active' | 'narrow' | 'none';

/** `narrow`: the current page is under More only below 480 px, so "More" looks current only there. */
function tabClasses(tone: TabTone) {
  return cn(
    'relative flex min-h-16 w-full flex-col items-center justify-center gap-0.5 px-0.5 text-center text-xs leading-tight font-semibold tracking-[-0.01em] whitespace-nowrap',
    tone === 'active' && 'text-brand',
    tone === 'narrow' && 'text-brand min-[480px]:text-ink-muted min-[480px]:hover:text-ink',
    tone === 'none' && 'text-ink-muted hover:text-ink',
  );
}

function TabContent({ item, tone }: { item: Pick<NavItem, 'label' | 'icon'>; tone: TabTone }) {
  return (
    <>
      <span
        aria-hidden="true"
        className={cn(
          'absolute inset-x-4 top-0 h-1 rounded-b-full',
          tone === 'active' && 'bg-copper-line',
          tone === 'narrow' && 'bg-copper-line min-[480px]:bg-transparent',
          tone === 'none' && 'bg-transparent',
        )}
      />
      <Icon name={item.icon} className="size-6" />
      {/* One line, so icons line up; "Work orders" (83 px) fits a 90 px slot, anything longer ends in "…". */}
      <span className="max-w-full truncate">{item.label}</span>
    </>
  );
}
