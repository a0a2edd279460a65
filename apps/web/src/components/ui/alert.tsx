import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';
import { Icon, type IconName } from './icon';

type Tone = 'info' | 'pass' | 'attention' | 'fail';

const tones: Record<Tone, { classes: string; icon: IconName }> = {
  info: { classes: 'border-brand/30 bg-brand-soft text-ink', icon: 'info' },
  pass: { classes: 'border-pass/40 bg-pass-soft text-ink', icon: 'check' },
  attention: { classes: 'border-attention/40 bg-attention-soft text-ink', icon: 'alert' },
  fail: { classes: 'border-fail/40 bg-fail-soft text-ink', icon: 'fail' },
};

const iconColour: Record<Tone, string> = { info: 'text-brand', pass: 'text-pass', attention: 'text-attention', fail: 'text-fail' };

/**
 * An inline message. Failures are announced at once (role="alert"); other tones politely (role="status").
 * Keep the element mounted and change its children when the message should be re-announced.
 */
export function Alert({ tone = 'info', title, children, className }: { tone?: Tone; title?: ReactNode; children?: ReactNode; className?: string }) {
  const { classes, icon } = tones[tone];
  return (
    <div role={tone === 'fail' ? 'alert' : 'status'} className={cn('flex gap-3 rounded-control border-2 p-3', classes, className)}>
      <Icon name={icon} className={cn('mt-0.5 size-6', iconColour[tone])} />
      <div className="min-w-0 space-y-1">
        {title ? <p className="font-semibold">{title}</p> : null}
        {children ? <div className="text-base">{children}</div> : null}
      </div>
    </div>
  );
}
