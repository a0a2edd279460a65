import { useState } from 'react';
import { toast } from '@/lib/toast';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/dialog';
import { Icon } from '@/components/ui/icon';
import { cn } from '@/lib/cn';
import { useCheckQueue } from '../hooks/use-check-queue';
import { useIsOnline } from '../hooks/use-is-online';
import type { CheckQueueEntry } from '../lib/check-queue';
import { formatNumber, formatTakenAt } from '../lib/format';
import { VerdictBadge } from './verdict-badge';

/** "2 waiting to send" / "1 needs you": the queue in one badge, announced as it changes. */
export function QueueBadge({ entries, isFlushing, className }: { entries: readonly CheckQueueEntry[]; isFlushing: boolean; className?: string }) {
  const held = entries.filter((e) => e.state === 'held').length;
  const pending = entries.length - held;
  const text =
    entries.length === 0
      ? 'All checks sent'
      : [pending ? `${pending} waiting to send` : null, held ? `${held} need${held === 1 ? 's' : ''} you` : null].filter(Boolean).join(' · ');
  return (
    <span
      className={cn(
        'inline-flex min-h-9 items-center gap-1.5 rounded-pill border-2 px-3 text-sm font-bold',
        entries.length === 0 ? 'border-pass/40 bg-pass-soft text-pass' : held ? 'border-fail bg-fail-soft text-fail' : 'border-attention bg-attention-soft text-attention',
        className,
      )}
    >
      <Icon name={entries.length === 0 ? 'check' : held ? 'alert' : isFlushing ? 'refresh' : 'clock'} className={cn('size-4', isFlushing && 'animate-spin motion-reduce:animate-none')} />
      {isFlushing && entries.length > 0 ? `Sending… ${text}` : text}
    </span>
  );
}

/**
 * The readings kept on this phone for one ticket (or all), in the order they will be sent. A held
 * reading shows the server's reason and offers Retry or Discard; nothing leaves without a decision.
 */
export function QueuePanel({ userId, workOrderId, onSent }: { userId: number; workOrderId?: number; onSent?: () => void }) {
  const { queue, snapshot } = useCheckQueue(userId);
  const [discarding, setDiscarding] = useState<CheckQueueEntry | null>(null);
  const [busyId, setBusyId] = useState<string | null>(null);
  const isOnline = useIsOnline();
  const entries = snapshot.entries.filter((e) => workOrderId === undefined || e.payload.workOrderId === workOrderId);
  if (entries.length === 0) return null;

  const retry = async (entry: CheckQueueEntry) => {
    setBusyId(entry.id);
    const outcome = await queue.retry(entry.id);
    setBusyId(null);
    if (outcome.kind === 'sent') {
      toast.success(`Check of ${entry.payload.stringLabel} sent`);
      onSent?.();
    } else if (outcome.kind === 'held') toast.error(`Still not accepted: ${outcome.reason}`);
    else toast(`Kept on this phone: ${outcome.reason}`);
  };

  return (
    <section aria-labelledby="queue-title" className="rounded-card border-2 border-attention bg-attention-soft/60 p-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="queue-title" className="text-lg font-bold">
          On this phone, not yet on the server
        </h2>
        <Button variant="secondary" onClick={() => void queue.flush()} isPending={snapshot.isFlushing} disabled={!isOnline || snapshot.isFlushing}>
          {snapshot.isFlushing ? null : <Icon name="send" />}
          Send now
        </Button>
      </div>
      <p className="text-sm text-ink-muted">
        {isOnline
          ? snapshot.nextRetryAt
            ? `The server could not be reached; trying again at ${new Date(snapshot.nextRetryAt).toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit', second: '2-digit' })}.`
            : 'Sent in the order they were taken.'
          : 'No connection. They are sent, in order, as soon as the phone is back online.'}
      </p>
      <ol className="mt-3 flex flex-col gap-2">
        {entries.map((entry) => (
          <li key={entry.id} className={cn('rounded-control border-2 bg-surface p-3', entry.state === 'held' ? 'border-fail' : 'border-line')}>
            <div className="flex flex-wrap items-center justify-between gap-2">
              <p className="font-semibold">
                {entry.payload.stringLabel} · <span className="readings">Voc {formatNumber(entry.payload.input.vocV, 1)} V</span>
              </p>
              {entry.payload.previewVerdict ? <VerdictBadge verdict={entry.payload.previewVerdict} prefix="Preview:" /> : null}
            </div>
            <p className="text-sm text-ink-muted">
              {entry.payload.kind === 'revision' ? 'Correction' : 'New check'} · {entry.payload.workOrderNumber} · taken {formatTakenAt(entry.payload.input.takenAt)}
            </p>
            {entry.state === 'held' ? (
              <>
                <p className="mt-2 flex gap-2 font-semibold text-fail">
                  <Icon name="alert" className="mt-0.5 size-5" />
                  <span>Not accepted: {entry.reason}</span>
                </p>
                <div className="mt-2 grid grid-cols-2 gap-2">
                  <Button variant="secondary" onClick={() => void retry(entry)} isPending={busyId === entry.id} disabled={!isOnline}>
                    {busyId === entry.id ? null : <Icon name="refresh" />}
                    Retry
                  </Button>
                  <Button variant="secondary" onClick={() => setDiscarding(entry)} className="text-fail">
                    <Icon name="close" />
                    Discard
                  </Button>
                </div>
              </>
            ) : entry.reason ? (
              <p className="mt-1 text-sm">{entry.reason}</p>
            ) : null}
          </li>
        ))}
      </ol>
      <ConfirmDialog
        isOpen={discarding !== null}
        onClose={() => setDiscarding(null)}
        onConfirm={() => {
          if (discarding) void queue.discard(discarding.id).then(() => toast(`Reading of ${discarding.payload.stringLabel} discarded`));
          setDiscarding(null);
        }}
        title="Discard this reading?"
        description={discarding ? `Voc ${formatNumber(discarding.payload.input.vocV, 1)} V on ${discarding.payload.stringLabel}, taken ${formatTakenAt(discarding.payload.input.takenAt)}. It has not reached the server and will be gone from this phone.` : undefined}
        confirmLabel="Discard reading"
      />
    </section>
  );
}
