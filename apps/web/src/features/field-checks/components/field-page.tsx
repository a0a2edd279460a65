import { workOrderStatusLabels, type StringCheck, type WorkOrderDetail } from '@stringfield/shared';
import { lazy, Suspense, useEffect, useMemo, useState } from 'react';
import { Link, useSearchParams } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { cn } from '@/lib/cn';
import { useStringSpecs } from '../api/get-string-spec';
import { useTicketChecks } from '../api/get-ticket-checks';
import { useCheckQueue } from '../hooks/use-check-queue';
import { useIsOnline } from '../hooks/use-is-online';
import { acknowledgeCaution, isCautionAcknowledged } from '../lib/caution';
import type { CheckQueueEntry } from '../lib/check-queue';
import { formatNumber, formatTakenAt } from '../lib/format';
import type { StringSpec } from '../lib/string-spec';
import { latestCurrentByString, queuedByString } from '../lib/ticket-checks';
import { CautionPanel } from './caution-panel';
import { QueueBadge, QueuePanel } from './queue-panel';
import { VerdictBadge } from './verdict-badge';

// One string's view (the check form, the live verdict's physics, the I-V trace) is most of this
// page's script; the list of strings shows without it, and it is fetched while the phone is idle so
// a tap opens the string at once. The service worker precaches it, so it opens offline too.
const loadStringView = () => import('./string-view');
const StringView = lazy(async () => ({ default: (await loadStringView()).StringView }));

function StringViewSkeleton() {
  return (
    <LoadingRegion label="Opening the string" className="flex flex-col gap-4">
      <Skeleton className="h-10 w-40" />
      <Skeleton className="h-8 w-1/2" />
      <Skeleton className="h-64 w-full rounded-card" />
    </LoadingRegion>
  );
}

type TicketString = WorkOrderDetail['strings'][number];

/**
 * The technician's page for one ticket in the field: its strings as large cards with their latest
 * verdict, and for the chosen string the check form, the saved verdict, corrections, the I-V trace
 * and the history. Works from the device's copy when there is no signal.
 */
export function FieldPage({ ticket, userId, canRecord }: { ticket: WorkOrderDetail; userId: number; canRecord: boolean }) {
  const [searchParams, setSearchParams] = useSearchParams();
  const checks = useTicketChecks(ticket.id);
  const specs = useStringSpecs(ticket.strings.map((s) => s.id));
  const { snapshot } = useCheckQueue(userId);
  const isOnline = useIsOnline();
  const [isAcknowledged, setIsAcknowledged] = useState(() => isCautionAcknowledged(userId));
  const [announcement, setAnnouncement] = useState('');

  const isInField = ticket.status === 'in_field';
  const isAssignedToMe = ticket.assignee?.id === userId;
  const canRecordHere = canRecord && isInField && isAssignedToMe;
  const selectedId = Number(searchParams.get('string'));
  const selected = ticket.strings.find((s) => s.id === selectedId);

  const ticketEntries = snapshot.entries.filter((e) => e.payload.workOrderId === ticket.id);
  const queued = useMemo(() => queuedByString(snapshot.entries, ticket.id), [snapshot.entries, ticket.id]);
  const latest = useMemo(() => latestCurrentByString(checks.data ?? []), [checks.data]);
  const specById = new Map<number, StringSpec>();
  for (const q of specs) if (q.data) specById.set(q.data.stringId, q.data);

  useEffect(() => {
    const prefetch = () => void loadStringView();
    if (typeof window.requestIdleCallback !== 'function') {
      const timer = window.setTimeout(prefetch, 1500);
      return () => window.clearTimeout(timer);
    }
    const handle = window.requestIdleCallback(prefetch, { timeout: 4000 });
    return () => window.cancelIdleCallback(handle);
  }, []);

  const open = (stringId: number | null) => {
    setSearchParams(stringId === null ? {} : { string: String(stringId) });
    window.scrollTo({ top: 0 });
  };

  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-5">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <Link to={paths.workOrder(ticket.id)} className="inline-flex min-h-touch items-center gap-1 font-semibold text-brand underline-offset-4 hover:underline">
          <Icon name="chevronLeft" /> Ticket {ticket.number}
        </Link>
        {ticketEntries.length > 0 ? (
          <a href="#field-queue" className="rounded-pill" aria-label={`${ticketEntries.length} reading${ticketEntries.length === 1 ? '' : 's'} on this phone, not yet sent: show them`}>
            <QueueBadge entries={ticketEntries} isFlushing={snapshot.isFlushing} className="min-h-touch px-4" />
          </a>
        ) : null}
      </div>

      <header>
        <p className="mb-1 text-sm font-semibold tracking-wide text-brand uppercase">
          {ticket.number} · {ticket.site.code}
        </p>
        <h1 className="text-2xl font-bold sm:text-3xl">Field checks</h1>
        <p className="mt-1 text-ink-muted">{ticket.title}</p>
      </header>

      <div aria-live="polite" className="sr-only">
        {announcement}
      </div>

      {!isOnline ? (
        <Alert tone="attention" title="No connection">
          Showing what this phone saved on its last visit. New checks are kept here and sent, in order, when the signal returns.
        </Alert>
      ) : null}

      {!isInField ? (
        <Alert tone="info" title={`This ticket is “${workOrderStatusLabels[ticket.status]}”`}>
          Checks are recorded while a ticket is in the field.{' '}
          {ticket.status === 'dispatched' || ticket.status === 'returned' ? (
            <Link to={paths.workOrder(ticket.id)} className="font-semibold text-brand underline underline-offset-4">
              Open the ticket to start the work
            </Link>
          ) : null}
        </Alert>
      ) : !isAssignedToMe && canRecord ? (
        <Alert tone="info" title="Assigned to someone else">
          Only {ticket.assignee?.name ?? 'the assigned technician'} records checks on this ticket.
        </Alert>
      ) : null}

      <div id="field-queue" className="scroll-mt-20">
        <QueuePanel userId={userId} workOrderId={ticket.id} />
      </div>

      {canRecordHere && !isAcknowledged ? (
        <CautionPanel
          onAcknowledge={() => {
            acknowledgeCaution(userId);
            setIsAcknowledged(true);
          }}
        />
      ) : selected ? (
        <Suspense fallback={<StringViewSkeleton />}>
          <StringView
            key={selected.id}
            ticket={ticket}
            item={selected}
            userId={userId}
            spec={specById.get(selected.id)}
            specQuery={specs[ticket.strings.indexOf(selected)]}
            checks={checks.data}
            checksQuery={checks}
            queued={queued.get(selected.id) ?? []}
            allQueued={ticketEntries}
            canRecord={canRecordHere}
            onBack={() => open(null)}
            onAnnounce={setAnnouncement}
          />
        </Suspense>
      ) : (
        <section aria-labelledby="strings-title" className="flex flex-col gap-3">
          <h2 id="strings-title" className="text-xl font-bold">
            Strings on this ticket
          </h2>
          {checks.isPending && checks.fetchStatus === 'paused' ? (
            <Alert tone="attention" title="Earlier checks are not on this phone">
              You can still record new checks; they are sent when the connection returns.
            </Alert>
          ) : null}
          {checks.isError && !checks.data ? (
            <ErrorState title="The checks did not load" error={checks.error} onRetry={() => void checks.refetch()} isRetrying={checks.isFetching} />
          ) : null}
          {ticket.strings.length === 0 ? (
            <EmptyState icon="bolt" title="No strings on this ticket" description="Ask the dispatcher to add the strings to check." />
          ) : (
            <ul className="flex flex-col gap-3">
              {ticket.strings.map((s) => (
                <li key={s.id}>
                  <StringCard
                    item={s}
                    latest={latest.get(s.id)}
                    queued={queued.get(s.id) ?? []}
                    isLoading={checks.isPending && checks.fetchStatus !== 'paused'}
                    href={paths.fieldChecks(ticket.id, { stringId: s.id })}
                  />
                </li>
              ))}
            </ul>
          )}
        </section>
      )}
    </div>
  );
}

function StringCard({ item, latest, queued, isLoading, href }: { item: TicketString; latest: StringCheck | undefined; queued: CheckQueueEntry[]; isLoading: boolean; href: string }) {
  const lastQueued = queued.at(-1);
  return (
    <Link
      to={href}
      className="flex min-h-20 items-center gap-3 rounded-card border-2 border-line bg-surface p-4 shadow-card hover:border-brand active:bg-sunken"
    >
      <span className="min-w-0 flex-1">
        <span className="block text-xl font-bold">{item.label}</span>
        <span className="block text-sm text-ink-muted">
          {item.inverterTag} · MPPT {item.mpptInput}
          {item.symptom ? ` · ${item.symptom}` : ''}
        </span>
        <span className="mt-2 flex flex-wrap items-center gap-2">
          {isLoading ? (
            <Skeleton className="h-6 w-32" />
          ) : latest ? (
            <>
              <VerdictBadge verdict={latest.verdict} />
              <span className="readings text-sm text-ink-muted">
                Voc {formatNumber(latest.vocV, 1)} V · {formatTakenAt(latest.takenAt)}
              </span>
            </>
          ) : (
            <span className="text-sm font-semibold text-ink-muted">No check yet</span>
          )}
          {lastQueued ? (
            <span className={cn('text-sm font-semibold', lastQueued.state === 'held' ? 'text-fail' : 'text-attention')}>
              {lastQueued.state === 'held' ? 'Reading not accepted: see above' : `${queued.length} on this phone, waiting to send`}
            </span>
          ) : null}
        </span>
      </span>
      <Icon name="chevronRight" className="size-7 text-ink-muted" />
    </Link>
  );
}
