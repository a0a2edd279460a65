import type { StringCheck } from '@stringfield/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { Link, useLocation } from 'react-router';
import { toast } from '@/lib/toast';
import { paths } from '@/config/paths';
import { fieldCheckKeys } from '../api/keys';
import { useCheckQueue } from '../hooks/use-check-queue';
import { isForeground, onCheckQueueEvent } from '../lib/check-queue';
import { mergeSavedCheck } from '../lib/ticket-checks';
import { verdictLabels } from '../lib/verdict';
import { QueueBadge } from './queue-panel';

/**
 * Sends what the phone kept whenever there is a chance: on start, when the connection returns and
 * when the app comes back to the foreground (plus the queue's own back-off). Keeps the cached checks
 * in step with what was sent and shows a small indicator on every page while readings wait.
 */
export function CheckQueueSync({ userId }: { userId: number }) {
  const { queue, snapshot } = useCheckQueue(userId);
  const queryClient = useQueryClient();
  const { pathname } = useLocation();

  useEffect(() => {
    const flush = () => void queue.flush();
    const onVisible = () => {
      if (document.visibilityState === 'visible') flush();
    };
    flush();
    window.addEventListener('online', flush);
    document.addEventListener('visibilitychange', onVisible);
    return () => {
      window.removeEventListener('online', flush);
      document.removeEventListener('visibilitychange', onVisible);
    };
  }, [queue]);

  useEffect(
    () =>
      onCheckQueueEvent((event) => {
        const { entry } = event;
        if (event.type === 'sent') {
          queryClient.setQueryData<StringCheck[]>(fieldCheckKeys.ticketChecks(entry.payload.workOrderId), (old) => (old ? mergeSavedCheck(old, event.check) : old));
          void queryClient.invalidateQueries({ queryKey: fieldCheckKeys.ticketChecks(entry.payload.workOrderId) });
          if (!isForeground(entry.id)) {
            toast.success(`Queued check of ${entry.payload.stringLabel} sent`, { description: `Server verdict: ${verdictLabels[event.check.verdict]}.` });
          }
        } else if (!isForeground(entry.id)) {
          toast.error(`Check of ${entry.payload.stringLabel} not accepted`, { description: entry.reason ?? undefined });
        }
      }),
    [queryClient],
  );

  const first = snapshot.entries[0];
  const fieldPath = first ? paths.fieldChecks(first.payload.workOrderId) : null;
  const isOnThatPage = fieldPath !== null && pathname === fieldPath;
  const held = snapshot.entries.filter((e) => e.state === 'held').length;
  const summary =
    snapshot.entries.length === 0
      ? ''
      : `${snapshot.entries.length} check${snapshot.entries.length === 1 ? '' : 's'} on this phone${held ? `, ${held} not accepted` : ', waiting to send'}.`;

  return (
    <>
      {/* Always mounted, so a change in the count is announced. */}
      <div role="status" aria-live="polite" className="sr-only">
        {summary}
      </div>
      {fieldPath && !isOnThatPage ? (
        <Link
          to={fieldPath}
          className="fixed right-3 bottom-20 z-40 rounded-pill shadow-raised lg:right-6 lg:bottom-6"
          aria-label={`${summary} Open the field page to see them.`}
        >
          <QueueBadge entries={snapshot.entries} isFlushing={snapshot.isFlushing} className="min-h-touch px-4 text-base" />
        </Link>
      ) : null}
    </>
  );
}
