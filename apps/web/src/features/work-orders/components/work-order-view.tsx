import {
  can,
  faultCategoryLabels,
  openStatuses,
  transitionInputSchema,
  workOrderSourceLabels,
  type Role,
  type TransitionInput,
  type WorkOrderDetail,
} from '@stringfield/shared';
import { useState, type ReactNode } from 'react';
import { Link } from 'react-router';
import { toast } from '@/lib/toast';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { paths, ticketAnchors } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { isConflict } from '../api/conflict';
import { useTransitionWorkOrder } from '../api/transition-work-order';
import { formatSiteTime, fromSiteInputValue } from '../lib/sla';
import { transitionActions, type TransitionAction } from '../lib/transitions';
import { CommentForm } from './comment-form';
import { ConflictBanner } from './conflict-banner';
import { EditWorkOrderDialog } from './edit-work-order-dialog';
import { SlaClock } from './sla-clock';
import { PriorityBadge, StatusBadge } from './status-badge';
import { TransitionBar } from './transition-bar';
import {
  TransitionDialog,
  emptyTransitionDraft,
  type TransitionDraft,
  type TransitionFieldErrors,
} from './transition-dialog';
import { WorkOrderTimeline } from './work-order-timeline';

function doneMessage(ticket: WorkOrderDetail): string {
  switch (ticket.status) {
    case 'dispatched':
      return `${ticket.number} assigned to ${ticket.assignee?.name ?? 'the technician'}`;
    case 'in_field':
      return `Work started on ${ticket.number}`;
    case 'awaiting_signoff':
      return `${ticket.number} submitted for sign-off`;
    case 'signed_off':
      return `${ticket.number} signed off`;
    case 'returned':
      return `${ticket.number} returned to ${ticket.assignee?.name ?? 'the technician'}`;
    case 'cancelled':
      return `${ticket.number} cancelled`;
    default:
      return `${ticket.number} saved`;
  }
}

function Section({ title, children, action }: { title: string; children: ReactNode; action?: ReactNode }) {
  const id = `section-${title.toLowerCase().replace(/[^a-z]+/g, '-')}`;
  return (
    <section aria-labelledby={id}>
      <div className="mb-3 flex items-center justify-between gap-3">
        <h2 id={id} className="text-xl font-semibold">
          {title}
        </h2>
        {action}
      </div>
      {children}
    </section>
  );
}

/**
 * One ticket: state, deadline and the actions the server allows, the strings and their symptoms,
 * and the history. Writes carry the version the person saw; on a clash a banner offers Reload and
 * every draft (reason, technician, comment, edits) stays as typed.
 */
export function WorkOrderView({
  ticket,
  role,
  onReload,
  isReloading,
  headerActions,
  panels,
  asidePanels,
  hiddenTransitions,
}: {
  ticket: WorkOrderDetail;
  role: Role;
  /** Extra actions beside the transitions (e.g. the technician's "Field checks" link), composed by the route. */
  headerActions?: ReactNode;
  /** Panels of other features (evidence, sign-off) shown after the strings, composed by the route. */
  panels?: ReactNode;
  /** Panels shown in the side column under the ticket details (e.g. the close-out report). */
  asidePanels?: ReactNode;
  /** Transitions another panel offers instead of the bar (sign-off, with its checklist and overrides). */
  hiddenTransitions?: readonly WorkOrderDetail['status'][];
  /** Fetches the ticket again and resolves with the fresh copy. */
  onReload: () => Promise<WorkOrderDetail | undefined>;
  isReloading: boolean;
}) {
  const transition = useTransitionWorkOrder();
  const [dialog, setDialog] = useState<{ action: TransitionAction; version: number } | null>(null);
  const [draft, setDraft] = useState<TransitionDraft>(emptyTransitionDraft);
  const [fieldErrors, setFieldErrors] = useState<TransitionFieldErrors>({});
  const [formError, setFormError] = useState<string | undefined>();
  const [conflict, setConflict] = useState<string | undefined>();
  const [editing, setEditing] = useState<{ version: number } | null>(null);
  const [pendingTo, setPendingTo] = useState<TransitionAction['to'] | undefined>();
  const [hasReloaded, setHasReloaded] = useState(false);

  const actions = transitionActions(
    ticket.allowedTransitions.filter((t) => !hiddenTransitions?.includes(t.to)),
    ticket.status,
  );
  const isOpen = openStatuses.includes(ticket.status);
  const canEdit = can(role, 'workOrders:dispatch') && isOpen;
  const canComment = can(role, 'workOrders:comment');
  const tz = ticket.site.timeZone;

  const reload = async () => {
    const fresh = await onReload();
    setConflict(undefined);
    setHasReloaded(true);
    setFormError(undefined);
    if (fresh) {
      // The person has now seen the latest; what they send next is checked against it.
      setDialog((d) => (d ? { ...d, version: fresh.version } : d));
      setEditing((e) => (e ? { version: fresh.version } : e));
    }
  };

  const send = (action: TransitionAction, version: number) => {
    setHasReloaded(false);
    setFieldErrors({});
    setFormError(undefined);
    const dueAt =
      action.kind === 'assign' && draft.dueLocal ? fromSiteInputValue(draft.dueLocal, tz) : undefined;
    const candidate: Record<string, unknown> = {
      to: action.to,
      version,
      reason: action.kind === 'reason' ? draft.reason.trim() || undefined : undefined,
      assigneeId: action.kind === 'assign' ? draft.assigneeId : undefined,
      dueAt,
    };
    const errors: TransitionFieldErrors = {};
    if (action.kind === 'reason' && !candidate.reason)
      errors.reason = 'Give a reason of at least 5 characters';
    if (action.kind === 'assign' && !draft.assigneeId) errors.assigneeId = 'Choose a technician';
    if (action.kind === 'assign' && draft.dueLocal && !dueAt) errors.dueAt = 'Pick a date and time';
    const parsed = transitionInputSchema.safeParse(candidate);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const key = issue.path[0];
        if (key === 'reason' || key === 'assigneeId' || key === 'dueAt') errors[key] ??= issue.message;
      }
    }
    if (Object.keys(errors).length > 0 || !parsed.success) {
      setFieldErrors(errors);
      return;
    }
    const input: TransitionInput = parsed.data;
    setPendingTo(action.to);
    transition.mutate(
      { id: ticket.id, input },
      {
        onSuccess: (detail) => {
          toast.success(doneMessage(detail));
          setDialog(null);
          setDraft(emptyTransitionDraft);
          setConflict(undefined);
        },
        onError: (error) => {
          if (isConflict(error)) {
            setConflict(error.message);
            return;
          }
          if (isApiError(error) && error.fields) {
            const next: TransitionFieldErrors = {};
            for (const [key, message] of Object.entries(error.fields)) {
              if (key === 'reason' || key === 'assigneeId' || key === 'dueAt') next[key] = message;
            }
            setFieldErrors(next);
            if (Object.keys(next).length > 0 && dialog) return;
          }
          if (dialog) setFormError(error.message);
          else toast.error(`${action.label} did not go through`, { description: error.message });
        },
        onSettled: () => setPendingTo(undefined),
      },
    );
  };

  const onAction = (action: TransitionAction) => {
    if (action.kind === 'direct') {
      send(action, ticket.version);
      return;
    }
    setFieldErrors({});
    setFormError(undefined);
    setHasReloaded(false);
    setDialog({ action, version: ticket.version });
  };

  const isDialogActionAvailable = dialog
    ? ticket.allowedTransitions.some((t) => t.to === dialog.action.to)
    : false;
  const returnedNow = ticket.returnReason && isOpen;

  return (
    <div className="flex flex-col gap-6">
      {conflict && !dialog && !editing ? (
        <ConflictBanner message={conflict} onReload={() => void reload()} isReloading={isReloading} />
      ) : null}

      {returnedNow ? (
        <Alert
          tone="fail"
          title={
            ticket.status === 'returned' ? 'Returned by the supervisor' : 'Returned earlier by the supervisor'
          }
        >
          <p className="whitespace-pre-wrap [overflow-wrap:anywhere]">{ticket.returnReason}</p>
        </Alert>
      ) : null}
      {canEdit && ticket.prioritySuggestion && ticket.priority !== ticket.prioritySuggestion.priority ? (
        <Alert tone="attention" title={`Raise to ${ticket.prioritySuggestion.priority}?`}>
          <p className="[overflow-wrap:anywhere]">{ticket.prioritySuggestion.reason}</p>
          <Button variant="secondary" className="mt-2" onClick={() => setEditing({ version: ticket.version })}>
            <Icon name="pencil" /> Change the priority
          </Button>
        </Alert>
      ) : null}
      {ticket.status === 'cancelled' && ticket.cancelReason ? (
        <Alert tone="info" title="Cancelled">
          <p className="whitespace-pre-wrap [overflow-wrap:anywhere]">{ticket.cancelReason}</p>
        </Alert>
      ) : null}

      <Card className="flex flex-col gap-4 p-4 sm:p-6">
        <div className="flex flex-col gap-2">
          <p className="readings text-sm font-semibold tracking-wide text-brand uppercase">
            {ticket.number} · {ticket.site.code}
          </p>
          <h1 className="text-2xl font-bold [overflow-wrap:anywhere] sm:text-3xl">{ticket.title}</h1>
          <div className="flex flex-wrap items-center gap-2">
            <StatusBadge status={ticket.status} />
            <PriorityBadge priority={ticket.priority} isLong />
            <span className="text-sm text-ink-muted">{faultCategoryLabels[ticket.faultCategory]}</span>
          </div>
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          <div>
            <p className="text-sm text-ink-muted">Deadline</p>
            <SlaClock dueAt={ticket.dueAt} status={ticket.status} timeZone={tz} size="lg" />
          </div>
          <div>
            <p className="text-sm text-ink-muted">Technician</p>
            <p className="text-lg font-semibold">
              {ticket.assignee?.name ?? <span className="text-ink-muted">Not assigned yet</span>}
            </p>
          </div>
        </div>
        {actions.length > 0 || canEdit || headerActions ? (
          <div className="flex flex-col gap-3 border-t border-line pt-4 sm:flex-row sm:flex-wrap sm:items-center">
            {headerActions}
            <TransitionBar actions={actions} onAction={onAction} pendingTo={dialog ? undefined : pendingTo} />
            {canEdit ? (
              <Button
                variant="ghost"
                onClick={() => setEditing({ version: ticket.version })}
                className="w-full sm:ml-auto sm:w-auto"
              >
                <Icon name="pencil" /> Edit details
              </Button>
            ) : null}
          </div>
        ) : null}
      </Card>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="flex min-w-0 flex-col gap-8">
          <Section title={ticket.strings.length === 1 ? 'String' : `Strings (${ticket.strings.length})`}>
            <ul className="flex flex-col divide-y divide-line rounded-card border border-line bg-surface shadow-card">
              {ticket.strings.map((s) => (
                <li key={s.id} id={ticketAnchors.string(s.id)} className="flex scroll-mt-24 flex-col gap-1 px-4 py-3 target:bg-brand-soft">
                  <div className="flex flex-wrap items-baseline justify-between gap-x-3">
                    <Link
                      to={paths.string(s.id)}
                      className="readings inline-flex min-h-touch items-center text-lg font-semibold text-brand underline underline-offset-4"
                    >
                      {s.label}
                    </Link>
                    <span className="text-sm text-ink-muted">
                      {s.inverterTag} · MPPT {s.mpptInput}
                    </span>
                  </div>
                  <p className={s.symptom ? 'text-ink' : 'text-ink-muted'}>
                    {s.symptom || 'No symptom noted.'}
                  </p>
                </li>
              ))}
            </ul>
          </Section>

          {ticket.description ? (
            <Section title="Description">
              <p className="whitespace-pre-wrap [overflow-wrap:anywhere]">{ticket.description}</p>
            </Section>
          ) : null}

          {panels}

          <Section title="History and comments">
            <div className="flex flex-col gap-6">
              <WorkOrderTimeline ticket={ticket} />
              {canComment ? <CommentForm workOrderId={ticket.id} /> : null}
            </div>
          </Section>
        </div>

        <aside aria-label="Ticket details" className="flex flex-col gap-6">
          <Card className="p-4">
            <dl className="flex flex-col gap-3">
              {(
                [
                  [
                    'Site',
                    <Link
                      key="site"
                      to={paths.site(ticket.site.id)}
                      className="font-semibold text-brand underline underline-offset-4"
                    >
                      {ticket.site.name}
                    </Link>,
                  ],
                  ['Site time zone', ticket.site.timeZone],
                  ['Reported', formatSiteTime(ticket.reportedAt, tz, { withYear: true })],
                  ['Due', formatSiteTime(ticket.dueAt, tz, { withYear: true })],
                  ['Fault category', faultCategoryLabels[ticket.faultCategory]],
                  ['Reported through', workOrderSourceLabels[ticket.source]],
                  ['Opened by', ticket.createdBy.name],
                ] as const
              ).map(([term, value]) => (
                <div key={term}>
                  <dt className="text-sm text-ink-muted">{term}</dt>
                  <dd className="readings">{value}</dd>
                </div>
              ))}
            </dl>
          </Card>
          {asidePanels}
        </aside>
      </div>

      {dialog ? (
        <TransitionDialog
          action={dialog.action}
          isAvailable={isDialogActionAvailable}
          ticket={ticket}
          draft={draft}
          onDraftChange={(changes) => setDraft((d) => ({ ...d, ...changes }))}
          fieldErrors={fieldErrors}
          formError={formError}
          conflictMessage={conflict}
          hasReloaded={hasReloaded}
          onReload={() => void reload()}
          isReloading={isReloading}
          isPending={transition.isPending}
          onSubmit={() => send(dialog.action, dialog.version)}
          // Closing keeps the draft: opening the same action again shows what was typed.
          onClose={() => setDialog(null)}
        />
      ) : null}

      {editing ? (
        <EditWorkOrderDialog
          ticket={ticket}
          baseVersion={editing.version}
          conflictMessage={conflict}
          onConflict={setConflict}
          onReload={() => void reload()}
          isReloading={isReloading}
          onClose={() => setEditing(null)}
        />
      ) : null}
    </div>
  );
}
