import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';
import { Icon, type IconName } from './icon';

export type BadgeTone = 'neutral' | 'brand' | 'pass' | 'attention' | 'fail';

const toneClasses: Record<BadgeTone, string> = {
  neutral: 'bg-sunken text-ink border-line',
  brand: 'bg-brand-soft text-brand border-brand/25',
  pass: 'bg-pass-soft text-pass border-pass/30',
  attention: 'bg-attention-soft text-attention border-attention/30',
  fail: 'bg-fail-soft text-fail border-fail/30',
};

/* Verdict tones always carry an icon as well as their colour, so they read without colour vision. */
const toneIcons: Partial<Record<BadgeTone, IconName>> = { pass: 'check', attention: 'alert', fail: 'fail' };

/** A short label; the text carries the meaning, colour and icon only reinforce it. */
export function Badge({ tone = 'neutral', icon, children, className }: { tone?: BadgeTone; icon?: IconName | null; children: ReactNode; className?: string }) {
  const iconName = icon === null ? undefined : (icon ?? toneIcons[tone]);
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1 rounded-pill border px-2.5 py-0.5 text-xs font-semibold whitespace-nowrap',
        toneClasses[tone],
        className,
      )}
    >
      {iconName ? <Icon name={iconName} className="size-4" /> : null}
      {children}
    </span>
  );
}
