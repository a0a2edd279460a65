import type { DiodeReplacement, Photo } from '@stringfield/shared';
import { useState } from 'react';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { ticketAnchors } from '@/config/paths';
import { cn } from '@/lib/cn';
import { useDiodeReplacements } from '../api/get-diode-replacements';
import { usePhotos } from '../api/get-photos';
import { diodeTypeLabels, failureModeLabels, foundByLabels } from '../lib/diode-form';
import { formatNumber } from '../lib/format';
import type { TicketString } from '../lib/group-photos';
import { photoAlt } from '../lib/group-photos';
import { DiodeReplacementForm } from './diode-replacement-form';
import { IsolationCaution } from './isolation-caution';

function partText(part: Record<string, unknown>): string {
  const bits = [
    typeof part.partNumber === 'string' && part.partNumber ? part.partNumber : null,
    typeof part.ratingA === 'number' ? `${part.ratingA} A` : null,
    typeof part.ratingV === 'number' ? `${part.ratingV} V` : null,
    part.type === 'schottky' || part.type === 'pn' ? diodeTypeLabels[part.type] : null,
  ].filter(Boolean);
  return bits.length ? bits.join(', ') : '—';
}

function volts(v: number | null): string {
  return v === null ? '—' : `${formatNumber(v, v < 10 ? 2 : 1)} V`;
}

function PhotoThumb({ photo, label }: { photo: Photo | undefined; label: string }) {
  if (!photo) return <span className="text-ink-muted">{label}: none</span>;
  return (
    <a href={photo.urls.screen} target="_blank" rel="noreferrer" className="flex min-h-touch items-center gap-2 font-semibold text-brand underline underline-offset-4">
      <img src={photo.urls.thumb} alt="" className="size-12 rounded-control object-cover" />
      <span>
        {label}
        <span className="sr-only">: {photoAlt(photo)}</span>
      </span>
    </a>
  );
}

/** One record as listed on the ticket and on the string's history. */
export function DiodeRecordCard({
  record,
  photos,
  onEdit,
  showTicket = false,
}: {
  record: DiodeReplacement;
  photos?: readonly Photo[];
  onEdit?: () => void;
  showTicket?: boolean;
}) {
  const isComplete = record.missing.length === 0;
  const photo = (id: number | null) => (id === null ? undefined : photos?.find((p) => p.id === id));
  return (
    <article id={ticketAnchors.diode(record.id)} aria-labelledby={`diode-${record.id}-title`} className="flex scroll-mt-24 flex-col gap-3 rounded-card border border-line bg-surface p-4 shadow-card">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 id={`diode-${record.id}-title`} className="readings text-lg font-semibold">
          {showTicket ? `${record.workOrderNumber} · ` : ''}
          {record.stringLabel} · module {record.modulePosition} · diode {record.diodePosition}
        </h3>
        {isComplete ? <Badge tone="pass">Complete</Badge> : <Badge tone="attention">Incomplete</Badge>}
      </div>
      {!isComplete ? (
        <p className="text-base">
          <span className="font-semibold">Missing:</span> {record.missing.join(', ')}
        </p>
      ) : null}
      <dl className="grid gap-x-4 gap-y-2 text-base sm:grid-cols-2">
        <div>
          <dt className="text-sm text-ink-muted">Failure found</dt>
          <dd>{failureModeLabels[record.failureMode]}</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">How found</dt>
          <dd>{foundByLabels[record.foundBy]}</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Module serial</dt>
          <dd className="readings">{record.moduleSerial || '—'}</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Removed</dt>
          <dd className="readings">{partText(record.removedPart)}</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Installed</dt>
          <dd className="readings">
            {partText(record.installedPart)}
            {record.newDiodeForwardV !== null ? `, Vf ${volts(record.newDiodeForwardV)}` : ''}
          </dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">String Voc before → after</dt>
          <dd className="readings">
            {volts(record.vocBeforeV)} → {volts(record.vocAfterV)}
          </dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">By</dt>
          <dd>
            {record.technician.name}, {new Date(record.createdAt).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' })}
          </dd>
        </div>
      </dl>
      {photos ? (
        <div className="flex flex-wrap gap-4">
          <PhotoThumb photo={photo(record.beforePhotoId)} label="Before" />
          <PhotoThumb photo={photo(record.afterPhotoId)} label="After" />
        </div>
      ) : null}
      {record.notes ? <p className="whitespace-pre-wrap [overflow-wrap:anywhere]">{record.notes}</p> : null}
      {onEdit ? (
        <Button variant={isComplete ? 'secondary' : 'primary'} className="self-start" onClick={onEdit}>
          <Icon name="pencil" /> {isComplete ? 'Edit the record' : 'Complete the record'}
        </Button>
      ) : null}
    </article>
  );
}

/**
 * The ticket's bypass-diode replacements with what each still lacks, and for the technician in the
 * field the form (behind the isolation caution) to record or complete one.
 */
export function DiodeReplacementsPanel({
  workOrderId,
  strings,
  canAdd,
  onSaved,
}: {
  workOrderId: number;
  strings: readonly TicketString[];
  canAdd: boolean;
  /** After a record is saved, e.g. to refresh the sign-off checklist. */
  onSaved?: () => void;
}) {
  const records = useDiodeReplacements(workOrderId);
  const photos = usePhotos(workOrderId);
  const [editing, setEditing] = useState<DiodeReplacement | 'new' | null>(null);
  const [saved, setSaved] = useState<{ text: string; isComplete: boolean } | null>(null);

  const close = (record?: DiodeReplacement) => {
    setEditing(null);
    if (record) onSaved?.();
    if (record)
      setSaved(
        record.missing.length === 0
          ? { text: 'Diode replacement saved: complete.', isComplete: true }
          : { text: `Diode replacement saved. Still missing: ${record.missing.join(', ')}.`, isComplete: false },
      );
    requestAnimationFrame(() => document.getElementById(record ? ticketAnchors.diode(record.id) : ticketAnchors.diodes)?.scrollIntoView({ block: 'start' }));
  };

  const form =
    editing !== null && canAdd ? (
      <div className="flex flex-col gap-4 rounded-card border-2 border-brand/30 bg-surface p-4">
        <h3 className="text-lg font-semibold">{editing === 'new' ? 'Record a diode replacement' : `Complete ${editing.stringLabel}, module ${editing.modulePosition}, diode ${editing.diodePosition}`}</h3>
        <IsolationCaution />
        <DiodeReplacementForm
          key={editing === 'new' ? 'new' : editing.id}
          workOrderId={workOrderId}
          strings={strings}
          photos={photos.data ?? []}
          record={editing === 'new' ? null : editing}
          onDone={close}
        />
      </div>
    ) : null;

  return (
    <div className="flex flex-col gap-4">
      <p role="status" aria-live="polite" className="empty:hidden">
        {saved ? (
          <span className={cn('inline-flex items-start gap-1.5 font-semibold', saved.isComplete ? 'text-pass' : 'text-ink')}>
            <Icon name={saved.isComplete ? 'check' : 'info'} className="mt-0.5 shrink-0" /> {saved.text}
          </span>
        ) : null}
      </p>
      {records.isPending ? (
        <LoadingRegion label="Loading the diode replacements">
          <Skeleton className="h-40" />
        </LoadingRegion>
      ) : records.isError ? (
        <ErrorState title="The diode replacements did not load" error={records.error} onRetry={() => void records.refetch()} isRetrying={records.isFetching} />
      ) : records.data.length === 0 && editing === null ? (
        <EmptyState
          icon="bolt"
          headingLevel={3}
          title="No diode replacements"
          description={canAdd ? 'If you replace a bypass diode, record it here with the parts and the Voc before and after.' : 'None recorded on this ticket.'}
        />
      ) : (
        <ul className="flex flex-col gap-3">
          {records.data.map((r) => (
            <li key={r.id}>{editing !== 'new' && editing?.id === r.id ? form : <DiodeRecordCard record={r} photos={photos.data} onEdit={canAdd ? () => setEditing(r) : undefined} />}</li>
          ))}
        </ul>
      )}
      {editing === 'new' ? form : null}
      {canAdd && editing === null ? (
        <Button variant="secondary" size="lg" className="self-start" onClick={() => {
            setSaved(null);
            setEditing('new');
          }}>
          <Icon name="plus" /> Record a diode replacement
        </Button>
      ) : null}
    </div>
  );
}
