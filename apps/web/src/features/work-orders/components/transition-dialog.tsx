import { workOrderStatusLabels, type WorkOrderDetail } from '@stringfield/shared';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormField, Input, Textarea } from '@/components/ui/form-field';
import { formatSiteTime } from '../lib/sla';
import type { TransitionAction } from '../lib/transitions';
import { ConflictBanner } from './conflict-banner';
import { TechnicianPicker } from './technician-picker';

/** What the person has typed or picked for a transition; kept by the page so nothing is lost on reload. */
export type TransitionDraft = { reason: string; assigneeId: number | undefined; dueLocal: string };
export const emptyTransitionDraft: TransitionDraft = { reason: '', assigneeId: undefined, dueLocal: '' };
export type TransitionFieldErrors = Partial<Record<'reason' | 'assigneeId' | 'dueAt', string>>;

const descriptions: Partial<Record<TransitionAction['to'], string>> = {
  signed_off: 'Signing off closes the ticket and stops its clock. The asset owner can then read it.',
  returned: 'The technician gets the ticket back with your reason at the top, and an e-mail.',
  cancelled: 'A cancelled ticket is closed without repair. Say why, for whoever reads it later.',
};

const reasonHints: Partial<Record<TransitionAction['to'], string>> = {
  returned: 'What is missing or needs doing again. At least 5 characters.',
  cancelled: 'For example: duplicate of another ticket, or the fault cleared itself. At least 5 characters.',
};

export function TransitionDialog({
  action,
  isAvailable,
  ticket,
  draft,
  onDraftChange,
  fieldErrors,
  formError,
  conflictMessage,
  hasReloaded = false,
  onReload,
  isReloading,
  isPending,
  onSubmit,
  onClose,
}: {
  action: TransitionAction;
  /** False once a reload shows the action is no longer possible; the typed text stays readable. */
  isAvailable: boolean;
  ticket: WorkOrderDetail;
  draft: TransitionDraft;
  onDraftChange: (changes: Partial<TransitionDraft>) => void;
  fieldErrors: TransitionFieldErrors;
  formError: string | undefined;
  conflictMessage: string | undefined;
  /** Set after a Reload, until the next send: tells the person the ticket behind the dialog is now the latest. */
  hasReloaded?: boolean;
  onReload: () => void;
  isReloading: boolean;
  isPending: boolean;
  onSubmit: () => void;
  onClose: () => void;
}) {
  const isAssign = action.kind === 'assign';
  const title = `${action.label}: ${ticket.number}`;
  const description = isAssign
    ? ticket.assignee
      ? `Now with ${ticket.assignee.name}. Choose who goes instead; they get an e-mail.`
      : 'Choose who goes. They get an e-mail, and the ticket appears in their My work.'
    : descriptions[action.to];

  return (
    <Dialog isOpen onClose={onClose} title={title} description={description}>
      <form
        noValidate
        className="flex flex-col gap-5"
        onSubmit={(event) => {
          event.preventDefault();
          if (isAvailable) onSubmit();
        }}
      >
        {conflictMessage ? (
          <ConflictBanner message={conflictMessage} onReload={onReload} isReloading={isReloading} />
        ) : null}
        {hasReloaded && isAvailable && !conflictMessage ? (
          <Alert tone="info">
            Reloaded. The ticket behind this dialog is the latest now; check it, then send again.
          </Alert>
        ) : null}
        {!isAvailable ? (
          <Alert tone="attention" title={`${action.label} is no longer possible`}>
            The ticket is now {workOrderStatusLabels[ticket.status]}. What you typed is kept below; copy it if
            you still need it.
          </Alert>
        ) : null}
        <div aria-live="assertive" className="empty:hidden">
          {formError ? <Alert tone="fail">{formError}</Alert> : null}
        </div>

        {isAssign ? (
          <>
            <TechnicianPicker
              value={draft.assigneeId}
              onChange={(assigneeId) => onDraftChange({ assigneeId })}
              error={fieldErrors.assigneeId}
              currentAssigneeId={ticket.assignee?.id}
            />
            <FormField
              label={`New due time (site time, ${ticket.site.timeZone})`}
              isOptional
              hint={`Leave empty to keep ${formatSiteTime(ticket.dueAt, ticket.site.timeZone)}.`}
              error={fieldErrors.dueAt}
            >
              <Input
                type="datetime-local"
                value={draft.dueLocal}
                onChange={(event) => onDraftChange({ dueLocal: event.target.value })}
              />
            </FormField>
          </>
        ) : null}

        {action.kind === 'reason' ? (
          <FormField label="Reason" hint={reasonHints[action.to]} error={fieldErrors.reason}>
            <Textarea
              rows={4}
              value={draft.reason}
              onChange={(event) => onDraftChange({ reason: event.target.value })}
              maxLength={2000}
            />
          </FormField>
        ) : null}

        <div className="flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
          <Button variant="secondary" onClick={onClose} disabled={isPending}>
            {isAvailable ? 'Not now' : 'Close'}
          </Button>
          {isAvailable ? (
            <Button
              type="submit"
              variant={action.variant === 'danger' ? 'danger' : 'primary'}
              isPending={isPending}
            >
              {action.kind === 'confirm' ? `Yes, ${action.label.toLowerCase()}` : action.label}
            </Button>
          ) : null}
        </div>
      </form>
    </Dialog>
  );
}
