import type { ReactNode } from 'react';
import { Wordmark } from '@/components/ui/wordmark';

/** The signed-out pages: brand band, one card, one job. */
export function AuthShell({ title, description, children, footer }: { title: string; description?: ReactNode; children: ReactNode; footer?: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col lg:flex-row">
      <a href="#main" className="sr-only focus:not-sr-only focus:fixed focus:top-3 focus:left-3 focus:z-50 focus:rounded-control focus:bg-surface focus:px-4 focus:py-3 focus:font-semibold focus:text-ink focus:shadow-raised">
        Skip to content
      </a>
      <header className="on-brand relative overflow-hidden bg-brand px-5 pt-6 pb-10 text-on-brand lg:flex lg:w-[42%] lg:flex-col lg:justify-between lg:p-12">
        <StringLines />
        <Wordmark className="relative" />
        <p className="relative mt-4 max-w-sm font-display text-xl leading-snug text-on-brand-muted lg:mt-0 lg:text-3xl lg:text-on-brand">
          DC string faults, from work order to <span className="whitespace-nowrap">sign-off</span>.
        </p>
        <p className="relative hidden text-on-brand-muted lg:block">For operations and maintenance crews.</p>
      </header>
      <main id="main" tabIndex={-1} className="-mt-6 flex flex-1 justify-center px-4 pb-10 lg:mt-0 lg:items-center lg:px-10 lg:py-12">
        <div className="w-full max-w-md">
          <div className="rounded-card border border-line bg-surface p-5 shadow-raised sm:p-8 lg:shadow-card">
            <h1 className="text-2xl font-bold">{title}</h1>
            {description ? <div className="mt-2 text-ink-muted">{description}</div> : null}
            <div className="mt-6">{children}</div>
          </div>
          {footer ? <div className="mt-6 text-center">{footer}</div> : null}
        </div>
      </main>
    </div>
  );
}

/* Quiet background: rows of strings with their connectors, drawn in the brand colour's own tints. */
function StringLines() {
  return (
    <svg aria-hidden="true" className="pointer-events-none absolute inset-0 h-full w-full opacity-[0.12]" preserveAspectRatio="xMidYMid slice" viewBox="0 0 400 400">
      {Array.from({ length: 12 }, (_, row) => (
        <g key={row}>
          <line x1="0" x2="400" y1={row * 34 + 12} y2={row * 34 + 12} stroke="currentColor" strokeWidth="1.5" />
          <circle cx={((row * 97) % 360) + 20} cy={row * 34 + 12} r="4" fill="currentColor" />
        </g>
      ))}
    </svg>
  );
}
