import { type Photo } from '@stringfield/shared';
import { useMemo, useState } from 'react';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { ticketAnchors } from '@/config/paths';
import { usePhotos } from '../api/get-photos';
import { formatCapturedAt, formatGps } from '../lib/format';
import { groupPhotos, photoAlt, viewerOrder, type TicketString } from '../lib/group-photos';
import { PhotoViewer } from './photo-viewer';
import { ThermalFindingForm } from './thermal-finding-form';
import { ThermalResult } from './thermal-result';

function Thumbnail({ photo, onOpen, timeZone }: { photo: Photo; onOpen: () => void; timeZone?: string }) {
  return (
    <figure className="flex min-w-0 flex-col overflow-hidden rounded-control border border-line bg-surface">
      <button
        type="button"
        onClick={onOpen}
        className="group relative block aspect-[4/3] w-full overflow-hidden bg-sunken"
        aria-label={`Open ${photoAlt(photo)} full screen`}
      >
        <img src={photo.urls.thumb} alt="" loading="lazy" className="size-full object-cover transition-transform group-hover:scale-105" />
      </button>
      <figcaption className="flex flex-col gap-0.5 p-2 text-sm">
        {photo.modulePosition ? <span className="readings font-semibold">Module {photo.modulePosition}</span> : null}
        {photo.caption ? <span className="line-clamp-2 [overflow-wrap:anywhere]">{photo.caption}</span> : null}
        <span className="readings text-ink-faint">
          {photo.capturedAt ? formatCapturedAt(photo.capturedAt, timeZone) : <>Uploaded {formatCapturedAt(photo.createdAt, timeZone)}</>}
        </span>
        {photo.gps ? (
          <span className="readings flex items-center gap-1 text-ink-faint">
            <Icon name="compass" className="size-4" />
            <span className="sr-only">GPS </span>
            {formatGps(photo.gps)}
          </span>
        ) : null}
      </figcaption>
    </figure>
  );
}

/** A thermal image with its finding beside it; the technician records or changes the finding here. */
function ThermalCard({
  photo,
  onOpen,
  canEdit,
  workOrderId,
  timeZone,
  onFindingSaved,
}: {
  photo: Photo;
  onOpen: () => void;
  canEdit: boolean;
  workOrderId: number;
  timeZone?: string;
  onFindingSaved?: () => void;
}) {
  const [isEditing, setIsEditing] = useState(false);
  const showForm = canEdit && (isEditing || !photo.thermal);
  return (
    <div className="grid gap-4 rounded-card border border-line bg-surface p-3 sm:grid-cols-[minmax(0,14rem)_minmax(0,1fr)]">
      <Thumbnail photo={photo} onOpen={onOpen} timeZone={timeZone} />
      <div className="flex min-w-0 flex-col gap-3">
        {showForm ? (
          <ThermalFindingForm
            photo={photo}
            workOrderId={workOrderId}
            onSaved={() => {
              setIsEditing(false);
              onFindingSaved?.();
            }}
            onCancel={photo.thermal ? () => setIsEditing(false) : undefined}
          />
        ) : photo.thermal ? (
          <>
            <ThermalResult thermal={photo.thermal} />
            {canEdit ? (
              <Button variant="secondary" className="self-start" onClick={() => setIsEditing(true)}>
                <Icon name="pencil" /> Change the finding
              </Button>
            ) : null}
          </>
        ) : (
          <p className="text-ink-muted">No finding recorded for this thermal image yet.</p>
        )}
      </div>
    </div>
  );
}

/**
 * The ticket's photos, by string and then by tag, each opening full screen. Thermal images carry
 * their finding (and, for the technician in the field, the form to record it).
 */
export function EvidenceGallery({
  workOrderId,
  strings,
  canAdd,
  timeZone,
  onFindingSaved,
}: {
  workOrderId: number;
  strings: readonly TicketString[];
  /** The assigned technician while the ticket is in the field. */
  canAdd: boolean;
  timeZone?: string;
  /** After a thermal finding is saved: the ticket's priority suggestion may have changed. */
  onFindingSaved?: () => void;
}) {
  const photos = usePhotos(workOrderId);
  const [open, setOpen] = useState<number | null>(null);
  const groups = useMemo(() => groupPhotos(photos.data ?? [], strings), [photos.data, strings]);
  const ordered = useMemo(() => viewerOrder(groups), [groups]);
  const indexOf = (photo: Photo) => ordered.findIndex((p) => p.id === photo.id);

  if (photos.isPending) {
    return (
      <LoadingRegion label="Loading the photos" className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        {[0, 1, 2, 3].map((i) => (
          <Skeleton key={i} className="aspect-[4/3]" />
        ))}
      </LoadingRegion>
    );
  }
  if (photos.isError) {
    return <ErrorState title="The photos did not load" error={photos.error} onRetry={() => void photos.refetch()} isRetrying={photos.isFetching} />;
  }
  if (ordered.length === 0) {
    return (
      <EmptyState
        icon="file"
        title="No photos yet"
        headingLevel={3}
        description={
          canAdd ? (
            <>
              Take a <strong>before</strong> photo, then an <strong>after</strong> photo of each string: sign-off needs at least one after-repair photo per string.
            </>
          ) : (
            'Photos appear here once the technician uploads them from the field.'
          )
        }
        action={
          canAdd ? (
            <a href={`#${ticketAnchors.upload}`} className="inline-flex min-h-touch items-center font-semibold text-brand underline underline-offset-4">
              Go to the upload
            </a>
          ) : undefined
        }
      />
    );
  }

  return (
    <div className="flex flex-col gap-6">
      {groups.map((group) => (
        <section key={group.key} id={`photos-${group.key}`} aria-labelledby={`photos-${group.key}-title`} className="scroll-mt-24">
          <h3 id={`photos-${group.key}-title`} className="mb-2 flex flex-wrap items-baseline gap-x-2 text-lg font-semibold">
            <span className="readings">{group.title}</span>
            <span className="text-base font-normal text-ink-muted">
              {group.count} {group.count === 1 ? 'photo' : 'photos'}
            </span>
          </h3>
          <div className="flex flex-col gap-4">
            {group.tags.map((t) => (
              <div key={t.tag}>
                <h4 className="mb-2">
                  <Badge tone={t.tag === 'after' ? 'pass' : t.tag === 'thermal' ? 'attention' : 'neutral'} icon={t.tag === 'thermal' ? 'bolt' : t.tag === 'after' ? 'check' : null}>
                    {t.label} · {t.photos.length}
                  </Badge>
                </h4>
                {t.tag === 'thermal' ? (
                  <div className="flex flex-col gap-3">
                    {t.photos.map((p) => (
                      <ThermalCard key={p.id} photo={p} onOpen={() => setOpen(indexOf(p))} canEdit={canAdd} workOrderId={workOrderId} timeZone={timeZone} onFindingSaved={onFindingSaved} />
                    ))}
                  </div>
                ) : (
                  <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4">
                    {t.photos.map((p) => (
                      <li key={p.id} className="min-w-0">
                        <Thumbnail photo={p} onOpen={() => setOpen(indexOf(p))} timeZone={timeZone} />
                      </li>
                    ))}
                  </ul>
                )}
              </div>
            ))}
          </div>
        </section>
      ))}
      <PhotoViewer photos={ordered} index={open} onIndexChange={setOpen} onClose={() => setOpen(null)} timeZone={timeZone} />
    </div>
  );
}
