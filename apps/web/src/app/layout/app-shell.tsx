import { roleLabels, type SessionUser } from '@stringfield/shared';
import { useEffect, useRef, type ReactNode } from 'react';
import { NavLink, useLocation } from 'react-router';
import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { Wordmark } from '@/components/ui/wordmark';
import { paths } from '@/config/paths';
import { useSignOut } from '@/features/auth/api/sign-out';
import { cn } from '@/lib/cn';
import { navItemsFor } from '../nav';

/**
 * The signed-in frame. Phones get a compact brand header and, when a role has more than one place
 * to go, a bottom tab bar within thumb reach; from 1024 px a side rail takes over.
 */
export function AppShell({ user, children }: { user: SessionUser; children: ReactNode }) {
  const items = navItemsFor(user.role);
  const hasTabBar = items.length > 1;
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
        <NavLink to={paths.home()} className="inline-flex min-h-touch items-center rounded-control px-1" aria-label="Stringfield, home">
          <Wordmark isCompact />
        </NavLink>
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
          <NavLink to={paths.home()} className="inline-flex rounded-control" aria-label="Stringfield, home">
            <Wordmark />
          </NavLink>
        </div>
        <nav aria-label="Main" className="flex-1 px-3">
          <ul className="flex flex-col gap-1">
            {items.map((item) => (
              <li key={item.to}>
                <NavLink
                  to={item.to}
                  end={item.isExact}
                  className={({ isActive }) =>
                    cn(
                      'flex min-h-touch items-center gap-3 rounded-control px-4 text-lg font-semibold transition-colors',
                      isActive ? 'bg-paper text-brand' : 'text-on-brand hover:bg-brand-strong',
                    )
                  }
                >
                  <Icon name={item.icon} className="size-6" />
                  {item.label}
                </NavLink>
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
        {children}
      </main>

      {hasTabBar ? (
        <nav aria-label="Main" className="fixed inset-x-0 bottom-0 z-30 border-t-2 border-line bg-surface pb-[env(safe-area-inset-bottom)] lg:hidden">
          <ul className="mx-auto flex max-w-xl">
            {items.map((item) => (
              <li key={item.to} className="flex-1">
                <NavLink
                  to={item.to}
                  end={item.isExact}
                  className={({ isActive }) =>
                    cn(
                      'relative flex min-h-16 flex-col items-center justify-center gap-0.5 text-sm font-semibold',
                      isActive ? 'text-brand' : 'text-ink-muted hover:text-ink',
                    )
                  }
                >
                  {({ isActive }) => (
                    <>
                      <span aria-hidden="true" className={cn('absolute inset-x-4 top-0 h-1 rounded-b-full', isActive ? 'bg-copper-line' : 'bg-transparent')} />
                      <Icon name={item.icon} className="size-6" />
                      {item.label}
                    </>
                  )}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
      ) : null}
    </div>
  );
}
