import type { StringCheck, WorkOrderDetail } from '@stringfield/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button, ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { cn } from '@/lib/cn';
import { toast } from '@/lib/toast';
import { fieldCheckKeys } from '../api/keys';
import type { CheckQueueEntry } from '../lib/check-queue';
import { checkToFormValues, emptyCheckValues, previousConditions } from '../lib/check-values';
import { newClientId } from '../lib/client-id';
import { formatTakenAt } from '../lib/format';
import type { StringSpec } from '../lib/string-spec';
import { latestCurrentByString, mergeSavedCheck } from '../lib/ticket-checks';
import { verdictLabels } from '../lib/verdict';
import { CheckForm, type SaveOutcome } from './check-form';
import { CheckHistory } from './check-history';
import { CheckResult } from './check-result';
import { IvTracePanel } from './iv-trace-panel';

// Loaded when a string is opened (field-page.tsx, lazily): the form, the physics of the live verdict
// and the I-V trace are most of the field page's script, and the list of strings needs none of them.

type TicketString = WorkOrderDetail['strings'][number];

type Mode = { kind: 'view' } | { kind: 'new'; clientId: string } | { kind: 'correct'; clientId: string; check: StringCheck };

/** One string of the ticket: its check form, the saved verdict, corrections, the I-V trace and the history. */
export function StringView({
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
