import { can, type Role, type SessionUser, type WorkOrderDetail } from '@stringfield/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, type ReactNode } from 'react';
import { Link, useLocation, useParams } from 'react-router';
import { ButtonLink, buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths, ticketAnchors } from '@/config/paths';
import { evidenceKeys } from '@/features/evidence/api/keys';
import { DiodeReplacementsPanel } from '@/features/evidence/components/diode-replacements-panel';
import { EvidenceGallery } from '@/features/evidence/components/evidence-gallery';
import { PhotoUploader } from '@/features/evidence/components/photo-uploader';
import { signOffKeys } from '@/features/sign-off/api/keys';
import { ReportPanel } from '@/features/sign-off/components/report-panel';
import { SignOffPanel } from '@/features/sign-off/components/sign-off-panel';
import { useWorkOrder } from '@/features/work-orders/api/get-work-order';
import { workOrderKeys } from '@/features/work-orders/api/keys';
import { WorkOrderView } from '@/features/work-orders/components/work-order-view';
import { isApiError } from '@/lib/api-client';
import { useSessionUser } from '../session';

function TicketSkeleton() {
  return (
    <LoadingRegion label="Loading the ticket" className="flex flex-col gap-6">
      <div className="flex flex-col gap-4 rounded-card border border-line bg-surface p-6">
        <Skeleton className="h-4 w-40" />
        <Skeleton className="h-9 w-3/4" />
        <div className="flex gap-2">
          <Skeleton className="h-7 w-28" />
          <Skeleton className="h-7 w-24" />
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          <Skeleton className="h-12" />
          <Skeleton className="h-12" />
        </div>
        <Skeleton className="h-14 w-full sm:w-48" />
      </div>
      <Skeleton className="h-32" />
      <Skeleton className="h-48" />
    </LoadingRegion>
  );
}

function Panel({ id, title, description, children }: { id: string; title: string; description?: ReactNode; children: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-title`} className="scroll-mt-24">
      <h2 id={`${id}-title`} className="mb-1 text-xl font-semibold">
        {title}
      </h2>
      {description ? <p className="mb-3 max-w-prose text-ink-muted">{description}</p> : <div className="mb-3" />}
      {children}
    </section>
  );
}

/** Whether this person adds evidence now: the assigned technician while the ticket is in the field. */
function canAddEvidence(user: SessionUser, ticket: WorkOrderDetail): boolean {
  return can(user.role, 'evidence:add') && ticket.assignee?.id === user.id && ticket.status === 'in_field';
}

/**
 * The panels other features add to the ticket page: evidence (photos, thermal findings, diode
 * records), sign-off and the close-out report. Each change refreshes what depends on it, so the
 * checklist and the priority suggestion follow the evidence without a reload.
 */
function useTicketPanels(ticket: WorkOrderDetail | undefined, role: Role, user: SessionUser) {
  const queryClient = useQueryClient();
  if (!ticket) return {};
  const canAdd = canAddEvidence(user, ticket);
  const strings = ticket.strings;
  const tz = ticket.site.timeZone;
  const refreshGates = () => void queryClient.invalidateQueries({ queryKey: signOffKeys.gates(ticket.id) });
  const refreshTicket = () => {
    void queryClient.invalidateQueries({ queryKey: workOrderKeys.detail(ticket.id) });
    void queryClient.invalidateQueries({ queryKey: workOrderKeys.lists() });
  };

  const canSignOff = ticket.allowedTransitions.some((t) => t.to === 'signed_off');
  const headerActions = canAdd ? (
    <ButtonLink to={paths.fieldChecks(ticket.id)} variant="brand" size="lg" className="w-full sm:w-auto">
      <Icon name="compass" /> Field checks
    </ButtonLink>
  ) : canSignOff ? (
    // Sign-off lives in its panel (checklist, overrides, comment); the bar keeps Return.
    <a href={`#${ticketAnchors.signOff}`} className={buttonClasses({ variant: 'primary', size: 'lg', className: 'w-full sm:w-auto' })}>
      <Icon name="check" /> Review and sign off
    </a>
  ) : null;

  const panels = (
    <>
      <Panel
        id={ticketAnchors.gallery}
        title="Photos"
        description={canAdd ? 'Tag each photo and tie it to its string; sign-off needs an after-repair photo of every string.' : undefined}
      >
        <div className="flex flex-col gap-6">
          {canAdd ? (
            <div id={ticketAnchors.upload} className="scroll-mt-24">
              <PhotoUploader workOrderId={ticket.id} strings={strings} onUploaded={refreshGates} />
            </div>
          ) : null}
          <EvidenceGallery workOrderId={ticket.id} strings={strings} canAdd={canAdd} timeZone={tz} onFindingSaved={refreshTicket} />
        </div>
      </Panel>
      <Panel id={ticketAnchors.diodes} title="Bypass-diode replacements">
        <DiodeReplacementsPanel workOrderId={ticket.id} strings={strings} canAdd={canAdd} onSaved={refreshGates} />
      </Panel>
      <Panel
        id={ticketAnchors.signOff}
        title="Sign-off"
        description={ticket.status === 'signed_off' ? undefined : 'What a supervisor checks before signing the ticket off.'}
      >
        <SignOffPanel
          ticket={{ id: ticket.id, number: ticket.number, version: ticket.version, status: ticket.status, timeZone: tz }}
          role={role}
          canWork={canAdd}
          onSignedOff={() => {
            refreshTicket();
            void queryClient.invalidateQueries({ queryKey: evidenceKeys.all });
          }}
          onReload={refreshTicket}
        />
      </Panel>
    </>
  );

  const asidePanels = (
    <Card className="p-4" id={ticketAnchors.report}>
      <h2 className="mb-2 text-lg font-semibold">Close-out report</h2>
      <ReportPanel workOrderId={ticket.id} workOrderNumber={ticket.number} isSignedOff={ticket.status === 'signed_off'} canPreview={role !== 'owner'} />
    </Card>
  );
  return { headerActions, panels, asidePanels, hiddenTransitions: ['signed_off'] as const };
}

/** Jumps to `#anchor` once the ticket is on screen (the panels render after the ticket loads). */
function useScrollToHash(isReady: boolean) {
  const { hash } = useLocation();
  useEffect(() => {
    if (!isReady || !hash) return;
    const target = document.getElementById(decodeURIComponent(hash.slice(1)));
    target?.scrollIntoView({ block: 'start' });
  }, [isReady, hash]);
}

/** One work order, by id: `/work-orders/:workOrderId`. */
export function WorkOrderRoute() {
  const user = useSessionUser();
  const { workOrderId } = useParams();
  const id = Number(workOrderId);
  const isValidId = Number.isInteger(id) && id > 0;
  const ticket = useWorkOrder(isValidId ? id : 0);
  const panels = useTicketPanels(ticket.data, user.role, user);
  useScrollToHash(Boolean(ticket.data));
  const back =
    user.role === 'technician'
      ? { to: paths.home(), label: 'My work' }
      : { to: paths.workOrders(), label: 'Work orders' };

  const backLink = (
    <Link
      to={back.to}
      className="mb-4 inline-flex min-h-touch items-center gap-1 font-semibold text-brand underline-offset-4 hover:underline"
    >
      <Icon name="chevronLeft" /> {back.label}
    </Link>
  );

  if (!isValidId || (ticket.isError && isApiError(ticket.error) && ticket.error.status === 404)) {
    return (
      <>
        {backLink}
        <EmptyState
          icon="search"
          title="That work order is not here"
          description={
            user.role === 'owner'
              ? 'Only signed-off tickets of your own sites can be opened. It may not be signed off yet.'
              : 'The link may be mistyped, or the ticket is not visible to your role.'
          }
          action={
            <ButtonLink to={back.to} variant="secondary">
              Back to {back.label.toLowerCase()}
            </ButtonLink>
          }
        />
      </>
    );
  }

  return (
    <div className="mx-auto max-w-5xl">
      {backLink}
      {ticket.isPending ? (
        <TicketSkeleton />
      ) : ticket.isError && !ticket.data ? (
        <ErrorState
          title="The ticket did not load"
          error={ticket.error}
          onRetry={() => void ticket.refetch()}
          isRetrying={ticket.isFetching}
        />
      ) : ticket.data ? (
        <WorkOrderView
          // A different ticket starts with fresh drafts; the same one keeps them across reloads.
          key={ticket.data.id}
          ticket={ticket.data}
          role={user.role}
          isReloading={ticket.isRefetching}
          onReload={async () => (await ticket.refetch()).data}
          headerActions={panels.headerActions}
          panels={panels.panels}
          asidePanels={panels.asidePanels}
          hiddenTransitions={panels.hiddenTransitions}
        />
      ) : null}
    </div>
  );
}
