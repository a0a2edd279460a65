import { photoTagLabels, type Photo } from '@stringfield/shared';
import { useEffect, useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { Spinner } from '@/components/ui/spinner';
import { formatCapturedAt, formatGps, mapUrl } from '../lib/format';
import { photoAlt } from '../lib/group-photos';

/** A horizontal drag longer than this, and mostly sideways, turns the page. */
const SWIPE_PX = 48;

/**
 * Full-screen photo viewer on the native <dialog>: the rest of the page is inert while it is open
 * (focus stays inside), Escape closes it, ← → and swipes move through the ticket's photos, and
 * focus returns to the thumbnail that opened it.
 */
export function PhotoViewer({
  photos,
  index,
  onIndexChange,
  onClose,
  timeZone,
}: {
  photos: readonly Photo[];
  /** The photo shown; null keeps the viewer closed. */
  index: number | null;
  onIndexChange: (index: number) => void;
  onClose: () => void;
  timeZone?: string;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const start = useRef<{ x: number; y: number; id: number } | null>(null);
  const [loadedId, setLoadedId] = useState<number | null>(null);
  const isOpen = index !== null;
  const photo = index !== null ? photos[index] : undefined;

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (isOpen && !dialog.open) dialog.showModal();
    if (!isOpen && dialog.open) dialog.close();
  }, [isOpen]);

  const go = (delta: number) => {
    if (index === null || photos.length < 2) return;
    onIndexChange((index + delta + photos.length) % photos.length);
  };

  const onKeyDown = (event: KeyboardEvent<HTMLDialogElement>) => {
    if (event.key === 'ArrowRight') {
      event.preventDefault();
      go(1);
    } else if (event.key === 'ArrowLeft') {
      event.preventDefault();
      go(-1);
    }
  };

  const onPointerDown = (event: PointerEvent<HTMLDivElement>) => {
    if (event.pointerType === 'mouse' && event.button !== 0) return;
    start.current = { x: event.clientX, y: event.clientY, id: event.pointerId };
  };
  const onPointerUp = (event: PointerEvent<HTMLDivElement>) => {
    const s = start.current;
    start.current = null;
    if (!s || s.id !== event.pointerId) return;
    const dx = event.clientX - s.x;
    const dy = event.clientY - s.y;
    if (Math.abs(dx) >= SWIPE_PX && Math.abs(dx) > Math.abs(dy) * 1.5) go(dx < 0 ? 1 : -1);
  };

  return (
    <dialog
      ref={ref}
      onClose={onClose}
      onKeyDown={onKeyDown}
      aria-label={photo ? `Photo ${index! + 1} of ${photos.length}: ${photoAlt(photo)}` : 'Photo'}
      className="m-0 h-dvh max-h-none w-screen max-w-none bg-ink p-0 text-white backdrop:bg-ink"
    >
      {photo ? (
        <div className="flex h-full flex-col">
          <div className="flex items-center justify-between gap-2 px-2 py-2 sm:px-4">
            <p className="readings px-2 text-base font-semibold" aria-live="polite">
              {index! + 1} / {photos.length}
            </p>
            <div className="flex items-center gap-1">
              <a
                href={photo.urls.original}
                target="_blank"
                rel="noreferrer"
                className="inline-flex min-h-touch items-center gap-1 rounded-control px-3 font-semibold text-white underline-offset-4 hover:underline focus-visible:outline-2 focus-visible:outline-focus-on-brand"
              >
                <Icon name="link" /> Original
              </a>
              <Button variant="ghost" onClick={onClose} className="w-touch px-0 text-white hover:bg-white/15 focus-visible:outline-focus-on-brand" aria-label="Close the photo">
                <Icon name="close" className="size-7" />
              </Button>
            </div>
          </div>

          <div
            className="relative flex min-h-0 flex-1 touch-pan-y items-center justify-center select-none"
            onPointerDown={onPointerDown}
            onPointerUp={onPointerUp}
            onPointerCancel={() => (start.current = null)}
          >
            {loadedId !== photo.id ? <Spinner className="absolute size-10 text-white" /> : null}
            <img
              key={photo.id}
              src={photo.urls.screen}
              alt={photoAlt(photo)}
              draggable={false}
              onLoad={() => setLoadedId(photo.id)}
              className="max-h-full max-w-full object-contain"
            />
            {photos.length > 1 ? (
              <>
                <Button
                  variant="ghost"
                  onClick={() => go(-1)}
                  aria-label="Previous photo"
                  className="absolute top-1/2 left-1 w-touch -translate-y-1/2 bg-ink/70 px-0 text-white hover:bg-ink focus-visible:outline-focus-on-brand sm:left-3"
                >
                  <Icon name="chevronLeft" className="size-7" />
                </Button>
                <Button
                  variant="ghost"
                  onClick={() => go(1)}
                  aria-label="Next photo"
                  className="absolute top-1/2 right-1 w-touch -translate-y-1/2 bg-ink/70 px-0 text-white hover:bg-ink focus-visible:outline-focus-on-brand sm:right-3"
                >
                  <Icon name="chevronRight" className="size-7" />
                </Button>
              </>
            ) : null}
          </div>

          <div className="max-h-[35dvh] overflow-y-auto px-4 py-3 text-base">
            <p className="font-semibold">
              {photoTagLabels[photo.tag]}
              {photo.stringLabel ? <span className="readings"> · {photo.stringLabel}</span> : null}
              {photo.modulePosition ? <span className="readings"> · module {photo.modulePosition}</span> : null}
            </p>
            {photo.caption ? <p className="[overflow-wrap:anywhere]">{photo.caption}</p> : null}
            <p className="readings text-sm text-white/85">
              {photo.capturedAt ? `Taken ${formatCapturedAt(photo.capturedAt, timeZone)}` : `Uploaded ${formatCapturedAt(photo.createdAt, timeZone)}`} by {photo.uploadedBy.name}
              {photo.gps ? (
                <>
                  {' · '}
                  <a href={mapUrl(photo.gps)} target="_blank" rel="noreferrer" className="underline underline-offset-4">
                    {formatGps(photo.gps)}
                  </a>
                </>
              ) : null}
            </p>
            <p className="mt-1 text-sm text-white/85">Swipe or use the ← → keys for the next photo; Esc closes.</p>
          </div>
        </div>
      ) : null}
    </dialog>
  );
}
