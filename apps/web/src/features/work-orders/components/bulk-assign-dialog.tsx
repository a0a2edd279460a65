import { transitionInputSchema, workOrderStatusLabels, type WorkOrderListItem } from '@stringfield/shared';
import { useState } from 'react';
import { toast } from '@/lib/toast';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { Icon } from '@/components/ui/icon';
import { isConflict } from '../api/conflict';
import { useTransitionWorkOrder } from '../api/transition-work-order';
import { canAssignFrom } from '../lib/transitions';
import { TechnicianPicker } from './technician-picker';

type RowResult = { item: WorkOrderListItem; outcome: 'done' | 'skipped' | 'failed'; message: string };

/**
 * "Assign to…" for several tickets: one dispatch (or reassign) per ticket with the version the board
 * showed, one after another, and a line per ticket saying how it went. A ticket someone else changed
 * meanwhile fails on its own and leaves the rest alone.
 */
export function BulkAssignDialog({
  items,
  onClose,
  onDone,
}: {
  items: WorkOrderListItem[];
  onClose: () => void;
  onDone: (assignedIds: number[]) => void;
}) {
  const transition = useTransitionWorkOrder();
  const [assigneeId, setAssigneeId] = useState<number | undefined>();
  const [error, setError] = useState<string | undefined>();
  const [results, setResults] = useState<RowResult[] | null>(null);
  const [isRunning, setIsRunning] = useState(false);
  const eligible = items.filter((i) => canAssignFrom(i.status));
  const skipped = items.filter((i) => !canAssignFrom(i.status));

  const run = async () => {
    if (!assigneeId) {
      setError('Choose a technician');
      return;
    }
    setError(undefined);
    setIsRunning(true);
    const out: RowResult[] = skipped.map((item) => ({
      item,
      outcome: 'skipped',
      message: `${workOrderStatusLabels[item.status]}: cannot be reassigned from the board`,
    }));
    for (const item of eligible) {
      try {
        const input = transitionInputSchema.parse({ to: 'dispatched', version: item.version, assigneeId });
        const detail = await transition.mutateAsync({ id: item.id, input });
        out.push({
          item,
          outcome: 'done',
          message: `Assigned to ${detail.assignee?.name ?? 'the technician'}`,
        });
      } catch (e) {
        const message = isConflict(e)
          ? 'Changed by someone else since the board loaded; open it to check'
          : e instanceof Error
            ? e.message
            : 'Failed';
        out.push({ item, outcome: 'failed', message });
      }
      setResults([...out]);
    }
    setResults(out);
    setIsRunning(false);
    const done = out.filter((r) => r.outcome === 'done');
    const failed = out.length - done.length;
    if (failed === 0) toast.success(`${done.length} ${done.length === 1 ? 'ticket' : 'tickets'} assigned`);
    else
      toast.warning(`${done.length} assigned, ${failed} not`, {
        description: 'See the list for each ticket.',
      });
    onDone(done.map((r) => r.item.id));
  };

  const icon = { done: 'check', skipped: 'info', failed: 'fail' } as const;
  const tone = { done: 'text-pass', skipped: 'text-ink-muted', failed: 'text-fail' } as const;

  return (
    <Dialog
      isOpen
      onClose={isRunning ? () => undefined : onClose}
      title={`Assign ${items.length} ${items.length === 1 ? 'ticket' : 'tickets'}`}
      description="Each ticket is dispatched, or reassigned if it already has a technician. Tickets already in the field are left alone."
    >
      <div className="flex flex-col gap-5">
        {results === null ? (
          <>
            {skipped.length > 0 ? (
              <Alert tone="attention">
                {skipped.length} of the selected {skipped.length === 1 ? 'ticket is' : 'tickets are'} past
                dispatch and will be skipped.
              </Alert>
            ) : null}
            <TechnicianPicker value={assigneeId} onChange={setAssigneeId} error={error} legend="Assign to" />
          </>
        ) : null}
        <div aria-live="polite">
          {results ? (
            <ul className="flex flex-col divide-y divide-line rounded-control border border-line bg-surface">
              {results.map((r) => (
                <li key={r.item.id} className="flex items-start gap-3 px-3 py-2">
                  <Icon name={icon[r.outcome]} className={`mt-0.5 ${tone[r.outcome]}`} />
                  <span className="min-w-0">
                    <span className="readings font-semibold">{r.item.number}</span>{' '}
                    <span className="text-ink-muted">{r.message}</span>
                  </span>
                </li>
              ))}
            </ul>
          ) : null}
        </div>
        <div className="flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
          {results && !isRunning ? (
            <Button variant="primary" onClick={onClose}>
              Done
            </Button>
          ) : (
            <>
              <Button variant="secondary" onClick={onClose} disabled={isRunning}>
                Cancel
              </Button>
              <Button
                variant="primary"
                onClick={() => void run()}
                isPending={isRunning}
                disabled={eligible.length === 0 || isRunning}
              >
                Assign {eligible.length} {eligible.length === 1 ? 'ticket' : 'tickets'}
              </Button>
            </>
          )}
        </div>
      </div>
    </Dialog>
  );
}
