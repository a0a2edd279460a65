import { useEffect, useId, useRef, type ReactNode } from 'react';
import { cn } from '@/lib/cn';
import { Button } from './button';
import { Icon } from './icon';

/**
 * A modal panel that rises from the bottom edge, within thumb reach, on the native <dialog>: the
 * browser keeps focus inside, Escape closes it and focus returns to whatever opened it. A press on
 * the dimmed backdrop closes it too.
 */
export function Sheet({
  isOpen,
  onClose,
  title,
  description,
  children,
  className,
}: {
  isOpen: boolean;
  onClose: () => void;
  title: string;
  description?: ReactNode;
  children: ReactNode;
  className?: string;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const descriptionId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (isOpen && !dialog.open) dialog.showModal();
    if (!isOpen && dialog.open) dialog.close();
  }, [isOpen]);

  // The backdrop belongs to the <dialog> itself: a press whose target is the dialog fell outside the panel.
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    const onPointerDown = (event: PointerEvent) => {
      if (event.target === dialog) onClose();
    };
    dialog.addEventListener('pointerdown', onPointerDown);
    return () => dialog.removeEventListener('pointerdown', onPointerDown);
  }, [onClose]);

  return (
    <dialog
      ref={ref}
      onClose={onClose}
      aria-labelledby={titleId}
      aria-describedby={description ? descriptionId : undefined}
      className={cn(
        'mx-auto mt-auto mb-0 w-full max-w-xl max-h-[calc(100dvh-3rem)] overflow-y-auto rounded-t-card border border-b-0 border-line bg-paper p-0 text-ink shadow-raised',
        'backdrop:bg-ink/60',
        className,
      )}
    >
      {isOpen ? (
        <div className="px-3 pt-4 pb-[calc(0.75rem+env(safe-area-inset-bottom))]">
          <div className="mb-2 flex items-start justify-between gap-4 pl-2">
            <div className="min-w-0 pt-1">
              <h2 id={titleId} className="text-xl font-bold">
                {title}
              </h2>
              {description ? (
                <div id={descriptionId} className="mt-0.5 text-sm text-ink-muted">
                  {description}
                </div>
              ) : null}
            </div>
            <Button variant="ghost" className="w-touch px-0" onClick={onClose} aria-label="Close">
              <Icon name="close" />
            </Button>
          </div>
          {children}
        </div>
      ) : null}
    </dialog>
  );
}
