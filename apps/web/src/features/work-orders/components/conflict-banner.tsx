import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';

/**
 * Shown when a save lost a race. Reload fetches the ticket again; whatever was typed in open forms
 * stays where it is, so it can be sent again (or copied) against the fresh version.
 */
export function ConflictBanner({
  message,
  onReload,
  isReloading,
}: {
  message: string;
  onReload: () => void;
  isReloading: boolean;
}) {
  return (
    <div
      role="alert"
      className="flex flex-col gap-3 rounded-control border-2 border-attention/60 bg-attention-soft p-3 sm:flex-row sm:items-center"
    >
      <Icon name="alert" className="size-6 text-attention" />
      <div className="min-w-0 flex-1">
        <p className="font-semibold">Changed by someone else</p>
        <p>{message}</p>
      </div>
      <Button variant="secondary" onClick={onReload} isPending={isReloading} className="shrink-0">
        {isReloading ? null : <Icon name="refresh" />}
        Reload
      </Button>
    </div>
  );
}
