import { signOffInputSchema, type Role, type SignOffInput, type WorkOrderStatus } from '@stringfield/shared';
import { useId, useRef, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/dialog';
import { ErrorState } from '@/components/ui/error-state';
import { FormField, Textarea } from '@/components/ui/form-field';
import { Icon } from '@/components/ui/icon';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { isApiError } from '@/lib/api-client';
import { cn } from '@/lib/cn';
import { toast } from '@/lib/toast';
import { useGates } from '../api/get-gates';
import { useSignOff } from '../api/get-sign-off';
import { gatesOfConflict, useSignOffWorkOrder } from '../api/sign-off-work-order';
import { blockingCount, type MissingItem } from '../lib/gate-links';
import { buildOverrides, mapOverrideFieldErrors, overridableItems, overrideReasonStatus } from '../lib/overrides';
import { SignOffChecklist } from './sign-off-checklist';
import { SignOffRecordView } from './sign-off-record';

type Ticket = { id: number; number: string; version: number; status: WorkOrderStatus; timeZone?: string };

function OverrideField({
  item,
  value,
  error,
  onChange,
}: {
  item: MissingItem;
  value: string;
  error: string | undefined;
  onChange: (value: string) => void;
}) {
  const id = useId();
  const status = overrideReasonStatus(value);
  return (
    <div className="mt-1 flex flex-col gap-1.5 rounded-control border border-line bg-paper p-3">
      <label htmlFor={id} className="font-semibold">
        Override reason <span className="font-normal text-ink-faint">(optional, supervisors only)</span>
      </label>
      <p id={`${id}-hint`} className="text-sm text-ink-muted">
        Accept this string without a passing after check, and say why in at least 20 characters. The reason goes into the report.
      </p>
      <Textarea
        id={id}
        rows={2}
        value={value}
        maxLength={2000}
        aria-describedby={`${id}-hint ${id}-count${error ? ` ${id}-error` : ''}`}
        aria-invalid={error ? true : undefined}
        onChange={(e) => onChange(e.target.value)}
      />
      <p id={`${id}-count`} className={cn('readings text-sm', status.isEmpty ? 'text-ink-muted' : status.isValid ? 'font-semibold text-pass' : 'font-semibold text-attention')}>
        {status.text}
      </p>
      {error ? (
        <p id={`${id}-error`} className="flex items-start gap-1.5 font-medium text-fail">
          <Icon name="fail" className="mt-0.5 size-5" /> {error}
        </p>
      ) : null}
      <span className="sr-only">{item.message}</span>
    </div>
  );
}

/**
 * Sign-off on the ticket page. Every staff role sees the checklist of what sign-off needs; the
 * supervisor, on a ticket awaiting sign-off, can override a failed after check with a reason,
 * comment and sign off. A refusal (409) refreshes the checklist from the answer; once signed off
 * the record shows with its digest and a "Verify evidence" check.
 */
export function SignOffPanel({
  ticket,
  role,
  canWork,
  onSignedOff,
  onReload,
}: {
  ticket: Ticket;
  role: Role;
  /** The assigned technician can still add evidence: links go to the field page and the upload. */
  canWork: boolean;
  /** After a sign-off: refresh the ticket, whose status and transitions changed. */
  onSignedOff: () => void;
  /** Fetch the ticket again after a "changed while you were reviewing" refusal. */
  onReload: () => void;
}) {
  const isSignedOff = ticket.status === 'signed_off';
  const isClosed = ticket.status === 'cancelled';
  const gates = useGates(ticket.id, { isEnabled: !isSignedOff && !isClosed });
  const record = useSignOff(ticket.id, { isEnabled: isSignedOff });
  const signOff = useSignOffWorkOrder(ticket.id);
  const [reasons, setReasons] = useState<Record<number, string>>({});
  const [reasonErrors, setReasonErrors] = useState<Record<number, string>>({});
  const [comment, setComment] = useState('');
  const [formError, setFormError] = useState<{ message: string; isStale: boolean } | null>(null);
  const [announcement, setAnnouncement] = useState('');
  const [confirming, setConfirming] = useState<SignOffInput | null>(null);
  const panelRef = useRef<HTMLDivElement>(null);
  const formErrorRef = useRef<HTMLDivElement>(null);
  const isDue = ticket.status === 'awaiting_signoff';
  const canSignOff = role === 'supervisor' && isDue;

  const submit = () => {
    const current = gates.data?.gates ?? [];
    const overridable = overridableItems(current).map((o) => o.stringId);
    const built = buildOverrides(reasons, overridable);
    setReasonErrors(built.errors);
    setFormError(null);
    if (Object.keys(built.errors).length > 0) {
      setAnnouncement('An override reason is too short.');
      return;
    }
    const parsed = signOffInputSchema.safeParse({ version: ticket.version, comment, overrides: built.overrides });
    if (!parsed.success) {
      setFormError({ message: parsed.error.issues[0]?.message ?? 'Check the form.', isStale: false });
      return;
    }
    // Signing off closes the ticket for good: ask once, with what it does.
    setConfirming(parsed.data);
  };

  const confirmSignOff = () => {
    if (!confirming) return;
    const sent = confirming;
    setAnnouncement('Signing off…');
    signOff.mutate(sent, {
      onSuccess: () => {
        setConfirming(null);
        setAnnouncement(`${ticket.number} signed off.`);
        toast.success(`${ticket.number} signed off`, { description: 'The ticket is closed and its close-out report is final.' });
        setReasons({});
        setComment('');
        onSignedOff();
        // The form gives way to the sign-off record; take the reader there rather than leave them further down.
        requestAnimationFrame(() => panelRef.current?.focus());
      },
      onError: (error) => {
        setConfirming(null);
        if (isApiError(error) && error.fields) {
          // Field errors name overrides by their place in what was sent.
          const mapped = mapOverrideFieldErrors(error.fields, sent.overrides);
          setReasonErrors(mapped.byString);
        }
        const hasGates = gatesOfConflict(error) !== undefined;
        const isStale = isApiError(error) && error.status === 409 && !hasGates;
        setFormError({ message: error.message, isStale });
        setAnnouncement(`Not signed off: ${error.message}`);
        requestAnimationFrame(() => formErrorRef.current?.focus());
      },
    });
  };

  let body;
  if (isSignedOff) {
    body = record.isPending ? (
      <LoadingRegion label="Loading the sign-off">
        <Skeleton className="h-28" />
      </LoadingRegion>
    ) : record.isError ? (
      <ErrorState title="The sign-off did not load" error={record.error} onRetry={() => void record.refetch()} isRetrying={record.isFetching} />
    ) : record.data ? (
      <SignOffRecordView record={record.data} timeZone={ticket.timeZone} />
    ) : (
      <p className="text-ink-muted">Signed off, but no sign-off record was found.</p>
    );
  } else if (isClosed) {
    body = <p className="text-ink-muted">Cancelled tickets are not signed off.</p>;
  } else if (gates.isPending) {
    body = (
      <LoadingRegion label="Loading the sign-off checklist" className="flex flex-col gap-2">
        <Skeleton className="h-12" />
        <Skeleton className="h-12" />
        <Skeleton className="h-12" />
      </LoadingRegion>
    );
  } else if (gates.isError) {
    body = <ErrorState title="The checklist did not load" error={gates.error} onRetry={() => void gates.refetch()} isRetrying={gates.isFetching} />;
  } else {
    const overridden = new Set(
      Object.entries(reasons)
        .filter(([, r]) => overrideReasonStatus(r).isValid)
        .map(([id]) => Number(id)),
    );
    const remaining = blockingCount(gates.data.gates, overridden);
    body = (
      <div className="flex flex-col gap-4">
        <p className="flex items-center gap-2 text-lg font-semibold">
          {gates.data.ok ? (
            <>
              <Icon name="check" className="size-6 text-pass" /> All evidence is in.
            </>
          ) : !isDue ? (
            <>
              <Icon name="clock" className="size-6 text-ink-muted" />
              {`${remaining} ${remaining === 1 ? 'item' : 'items'} to do before sign-off.`}
            </>
          ) : (
            <>
              <Icon name="alert" className="size-6 text-attention" />
              {remaining === 0 ? 'Ready once the overrides are sent.' : `${remaining} ${remaining === 1 ? 'item is' : 'items are'} missing.`}
            </>
          )}
          {gates.isFetching ? <span className="text-sm font-normal text-ink-muted">Checking…</span> : null}
        </p>
        <SignOffChecklist
          gates={gates.data.gates}
          isDue={isDue}
          workOrderId={ticket.id}
          canWork={canWork}
          renderOverride={
            canSignOff
              ? (item) =>
                  item.stringId === null ? null : (
                    <OverrideField
                      item={item}
                      value={reasons[item.stringId] ?? ''}
                      error={reasonErrors[item.stringId]}
                      onChange={(v) => {
                        const stringId = item.stringId!;
                        setReasons((r) => ({ ...r, [stringId]: v }));
                        // A message about the old text would be wrong about the new one.
                        setReasonErrors(({ [stringId]: _old, ...rest }) => rest);
                      }}
                    />
                  )
              : undefined
          }
        />
        {canSignOff ? (
          <div className="flex flex-col gap-4 border-t border-line pt-4">
            <FormField label="Comment for the close-out report" isOptional hint="The asset owner reads it in the report.">
              <Textarea rows={3} maxLength={2000} value={comment} onChange={(e) => setComment(e.target.value)} />
            </FormField>
            <div ref={formErrorRef} tabIndex={-1} className="empty:hidden focus:outline-none">
              {formError ? (
                <Alert tone="fail" title="Not signed off">
                  <p>{formError.message}</p>
                  {formError.isStale ? (
                    <Button variant="secondary" className="mt-2" onClick={onReload}>
                      <Icon name="refresh" /> Reload the ticket
                    </Button>
                  ) : null}
                </Alert>
              ) : null}
            </div>
            <Button variant="primary" size="lg" className="w-full sm:w-auto sm:self-start" onClick={submit} isPending={signOff.isPending}>
              {signOff.isPending ? null : <Icon name="check" />} Sign off {ticket.number}
            </Button>
            <p className="text-sm text-ink-muted">To send it back to the technician instead, use Return in the actions at the top.</p>
          </div>
        ) : !isDue ? (
          <p className="text-ink-muted">A supervisor signs the ticket off once the technician submits it.</p>
        ) : role !== 'supervisor' ? (
          <p className="text-ink-muted">Awaiting a supervisor&apos;s sign-off.</p>
        ) : null}
      </div>
    );
  }

  return (
    <div ref={panelRef} tabIndex={-1} className="flex scroll-mt-20 flex-col gap-3 focus:outline-none">
      <p role="status" aria-live="polite" className="sr-only">
        {announcement}
      </p>
      {body}
      <ConfirmDialog
        isOpen={confirming !== null}
        onClose={() => setConfirming(null)}
        onConfirm={confirmSignOff}
        isPending={signOff.isPending}
        tone="primary"
        title={`Sign off ${ticket.number}?`}
        description="The ticket closes and its close-out report becomes final, with your name on it. A signed-off ticket cannot be reopened; a new fault on these strings needs a new ticket."
        confirmLabel="Sign off"
      />
    </div>
  );
}
