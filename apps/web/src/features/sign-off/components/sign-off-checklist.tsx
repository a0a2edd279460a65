import type { Gate } from '@stringfield/shared';
import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { Icon } from '@/components/ui/icon';
import { cn } from '@/lib/cn';
import { linkForMissing, type MissingItem } from '../lib/gate-links';

/**
 * The sign-off gates as a checklist: ✓ or ✗ with words, each missing item with a link to where it
 * is fixed. `renderOverride` lets the supervisor's form put an override field under an item.
 */
export function SignOffChecklist({
  gates,
  workOrderId,
  canWork,
  renderOverride,
  isDue = true,
}: {
  gates: readonly Gate[];
  workOrderId: number;
  canWork: boolean;
  renderOverride?: (item: MissingItem) => ReactNode;
  /** Whether sign-off is due (the ticket awaits it): what is not in yet is then missing, before that only to do. */
  isDue?: boolean;
}) {
  return (
    <ul className="flex flex-col divide-y divide-line rounded-card border border-line bg-surface" aria-label="Sign-off checklist">
      {gates.map((gate) => (
        <li key={gate.code} className="flex flex-col gap-2 p-3 sm:p-4">
          <p className="flex items-start gap-2">
            <Icon
              name={gate.ok ? 'check' : isDue ? 'fail' : 'clock'}
              className={cn('mt-0.5 size-6 shrink-0', gate.ok ? 'text-pass' : isDue ? 'text-fail' : 'text-ink-muted')}
            />
            <span className="min-w-0">
              <span className={cn('mr-1 font-bold', gate.ok ? 'text-pass' : isDue ? 'text-fail' : 'text-ink-muted')}>{gate.ok ? 'Done:' : isDue ? 'Missing:' : 'To do:'}</span>
              <span className="font-semibold">{gate.label}</span>
            </span>
          </p>
          {gate.missing.length > 0 ? (
            <ul className="ml-8 flex flex-col gap-2">
              {gate.missing.map((item, i) => {
                const link = linkForMissing(gate.code, item, { workOrderId, canWork });
                return (
                  <li key={`${item.stringId ?? 'none'}-${i}`} className="flex flex-col gap-1">
                    <p className="readings [overflow-wrap:anywhere]">{item.message}</p>
                    {link ? (
                      link.isInPage ? (
                        <a href={link.href} className="inline-flex min-h-touch items-center gap-1 self-start font-semibold text-brand underline underline-offset-4">
                          {link.label} <Icon name="arrowRight" className="size-4" />
                        </a>
                      ) : (
                        <Link to={link.href} className="inline-flex min-h-touch items-center gap-1 self-start font-semibold text-brand underline underline-offset-4">
                          {link.label} <Icon name="arrowRight" className="size-4" />
                        </Link>
                      )
                    ) : null}
                    {item.overridable && renderOverride ? renderOverride(item) : null}
                  </li>
                );
              })}
            </ul>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
