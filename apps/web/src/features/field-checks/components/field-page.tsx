import { workOrderStatusLabels, type StringCheck, type WorkOrderDetail } from '@stringfield/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { Link, useSearchParams } from 'react-router';
import { toast } from 'sonner';
import { Alert } from '@/components/ui/alert';
import { Button, ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { cn } from '@/lib/cn';
import { useStringSpecs } from '../api/get-string-spec';
import { useTicketChecks } from '../api/get-ticket-checks';
import { fieldCheckKeys } from '../api/keys';
import { useCheckQueue } from '../hooks/use-check-queue';
import { useIsOnline } from '../hooks/use-is-online';
import { acknowledgeCaution, isCautionAcknowledged } from '../lib/caution';
import type { CheckQueueEntry } from '../lib/check-queue';
import { checkToFormValues, emptyCheckValues, previousConditions } from '../lib/check-values';
import { newClientId } from '../lib/client-id';
import { formatNumber, formatTakenAt } from '../lib/format';
import type { StringSpec } from '../lib/string-spec';
import { latestCurrentByString, mergeSavedCheck, queuedByString } from '../lib/ticket-checks';
import { verdictLabels } from '../lib/verdict';
import { CautionPanel } from './caution-panel';
import { CheckForm, type SaveOutcome } from './check-form';
import { CheckHistory } from './check-history';
import { CheckResult } from './check-result';
import { IvTracePanel } from './iv-trace-panel';
import { QueueBadge, QueuePanel } from './queue-panel';
import { VerdictBadge } from './verdict-badge';

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

type Mode = { kind: 'view' } | { kind: 'new'; clientId: string } | { kind: 'correct'; clientId: string; check: StringCheck };

function StringView({
  ticket,
  item,
  userId,
  spec,
  specQuery,
  checks,
  checksQuery,
  queued,
  allQueued,
  canRecord,
  onBack,
  onAnnounce,
}: {
  ticket: WorkOrderDetail;
  item: TicketString;
  userId: number;
  spec: StringSpec | undefined;
  specQuery: { isPending: boolean; isError: boolean; error: unknown; refetch: () => unknown; isFetching: boolean } | undefined;
  checks: StringCheck[] | undefined;
  checksQuery: { isPending: boolean };
  queued: CheckQueueEntry[];
  allQueued: CheckQueueEntry[];
  canRecord: boolean;
  onBack: () => void;
  onAnnounce: (text: string) => void;
}) {
  const queryClient = useQueryClient();
  const stringChecks = useMemo(() => (checks ?? []).filter((c) => c.stringId === item.id), [checks, item.id]);
  const current = useMemo(() => latestCurrentByString(stringChecks).get(item.id), [stringChecks, item.id]);
  const [mode, setMode] = useState<Mode>(() => (canRecord && !current && queued.length === 0 ? { kind: 'new', clientId: newClientId() } : { kind: 'view' }));
  const [justSaved, setJustSaved] = useState<number | null>(null);
  const previous = useMemo(
    () =>
      previousConditions(
        checks ?? [],
        allQueued.map((e) => e.payload.input),
        userId,
      ),
    [checks, allQueued, userId],
  );

  const onDone = (outcome: SaveOutcome) => {
    if (outcome.kind === 'saved') {
      queryClient.setQueryData<StringCheck[]>(fieldCheckKeys.ticketChecks(ticket.id), (old) => mergeSavedCheck(old, outcome.check));
      void queryClient.invalidateQueries({ queryKey: fieldCheckKeys.ticketChecks(ticket.id) });
      const first = outcome.check.findings[0]?.message;
      toast.success(`Saved: ${verdictLabels[outcome.check.verdict]}`, { description: first ?? 'No findings.' });
      onAnnounce(`Check of ${item.label} saved. Server verdict: ${verdictLabels[outcome.check.verdict]}. ${first ?? ''}`);
      setJustSaved(outcome.check.id);
    } else if (outcome.kind === 'queued') {
      toast('Saved on this phone', { description: 'It will be sent when the connection returns.' });
      onAnnounce(`Check of ${item.label} saved on this phone; it will be sent when the connection returns.`);
    } else {
      toast.error('Not accepted by the server', { description: outcome.reason });
      onAnnounce(`Check of ${item.label} was not accepted: ${outcome.reason} It is kept on this phone.`);
    }
    setMode({ kind: 'view' });
    window.scrollTo({ top: 0 });
  };

  const defaultPhase = stringChecks.some((c) => c.supersededById === null && c.phase === 'before') ? 'after' : 'before';

  return (
    <section aria-labelledby="string-view-title" className="flex flex-col gap-4">
      <div>
        <Button variant="ghost" onClick={onBack} className="-ml-3">
          <Icon name="chevronLeft" /> All strings
        </Button>
        <h2 id="string-view-title" className="text-2xl font-bold">
          {item.label}
        </h2>
        <p className="text-ink-muted">
          {item.inverterTag} · MPPT {item.mpptInput}
          {spec ? ` · ${spec.modulesInSeries} × ${spec.moduleName}` : ''}
        </p>
        {item.symptom ? <p className="mt-1">Reported: {item.symptom}</p> : null}
      </div>

      {!spec ? (
        specQuery?.isError ? (
          <ErrorState title="The string's datasheet did not load" error={specQuery.error} onRetry={() => void specQuery.refetch()} isRetrying={specQuery.isFetching} />
        ) : (
          <LoadingRegion label="Loading the string's datasheet">
            <Skeleton className="h-64 w-full rounded-card" />
          </LoadingRegion>
        )
      ) : mode.kind === 'new' || mode.kind === 'correct' ? (
        <CheckForm
          key={mode.clientId}
          spec={spec}
          ticket={ticket}
          userId={userId}
          correcting={mode.kind === 'correct' ? mode.check : undefined}
          defaultValues={
            mode.kind === 'correct'
              ? checkToFormValues(mode.check, mode.clientId)
              : emptyCheckValues({ clientId: mode.clientId, stringId: item.id, takenAt: new Date().toISOString(), phase: defaultPhase })
          }
          previous={previous}
          onDone={onDone}
          onCancel={() => setMode({ kind: 'view' })}
        />
      ) : (
        <>
          {checksQuery.isPending ? (
            <LoadingRegion label="Loading the checks">
              <Skeleton className="h-48 w-full rounded-card" />
            </LoadingRegion>
          ) : current ? (
            <div className={cn('flex flex-col gap-3', justSaved === current.id && 'rounded-card ring-4 ring-brand/40')}>
              {queued.length > 0 ? (
                <Alert tone="attention" title="A newer reading is on this phone">
                  Taken {formatTakenAt(queued.at(-1)!.payload.input.takenAt)}, not yet on the server. The verdict below is the last one the server has.
                </Alert>
              ) : null}
              <CheckResult
                check={current}
                actions={
                  canRecord ? (
                    <>
                      <Button variant="primary" size="lg" onClick={() => setMode({ kind: 'new', clientId: newClientId() })}>
                        <Icon name="plus" /> New check
                      </Button>
                      <Button variant="secondary" size="lg" onClick={() => setMode({ kind: 'correct', clientId: newClientId(), check: current })}>
                        <Icon name="pencil" /> Correct this reading
                      </Button>
                    </>
                  ) : null
                }
              />
            </div>
          ) : queued.length > 0 ? (
            <Alert tone="attention" title="Kept on this phone">
              The reading of {formatTakenAt(queued.at(-1)!.payload.input.takenAt)} has not reached the server yet, so there is no saved verdict. See the list above.
            </Alert>
          ) : (
            <EmptyState
              icon="bolt"
              title="No check of this string yet"
              headingLevel={3}
              action={
                canRecord ? (
                  <Button variant="primary" size="lg" onClick={() => setMode({ kind: 'new', clientId: newClientId() })}>
                    <Icon name="plus" /> Start a check
                  </Button>
                ) : null
              }
            />
          )}
          {current && spec ? <IvTracePanel check={current} spec={spec} canUpload={canRecord} /> : null}
          <CheckHistory checks={stringChecks} />
          <ButtonLink to={paths.fieldChecks(ticket.id)} variant="secondary" size="lg" isFullWidth>
            Back to all strings
          </ButtonLink>
        </>
      )}
    </section>
  );
}
