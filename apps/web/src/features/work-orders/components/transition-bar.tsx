import { Button } from '@/components/ui/button';
import { Icon, type IconName } from '@/components/ui/icon';
import { cn } from '@/lib/cn';
import type { TransitionAction } from '../lib/transitions';

const icons: Partial<Record<TransitionAction['to'], IconName>> = {
  dispatched: 'user',
  in_field: 'play',
  awaiting_signoff: 'send',
  signed_off: 'check',
  returned: 'undo',
  cancelled: 'close',
};

/**
 * The transitions the server allows the signed-in person now, as buttons. On a phone they stack at
 * full width and the main one is large, for a gloved thumb.
 */
export function TransitionBar({
  actions,
  onAction,
  pendingTo,
  className,
}: {
  actions: TransitionAction[];
  onAction: (action: TransitionAction) => void;
  /** The transition being sent right now (direct ones show their spinner on the button). */
  pendingTo?: TransitionAction['to'] | undefined;
  className?: string;
}) {
  if (actions.length === 0) return null;
  return (
    <div
      role="group"
      aria-label="Actions"
      className={cn('flex flex-col gap-3 sm:flex-row sm:flex-wrap', className)}
    >
      {actions.map((action) => {
        const isPending = pendingTo === action.to;
        const icon = icons[action.to];
        return (
          <Button
            key={`${action.to}-${action.label}`}
            variant={action.variant}
            size={action.variant === 'primary' ? 'lg' : 'md'}
            onClick={() => onAction(action)}
            isPending={isPending}
            disabled={pendingTo !== undefined}
            // Cancelling the ticket stands apart from the steps that move it on.
            className={cn('w-full sm:w-auto', action.variant === 'danger' && 'mt-4 sm:mt-0 sm:ml-auto')}
          >
            {isPending || !icon ? null : <Icon name={icon} />}
            {/* The ellipsis says a question comes before anything happens. */}
            {action.kind === 'direct' ? action.label : `${action.label}…`}
          </Button>
        );
      })}
    </div>
  );
}
