import { useEffect, useId, useRef, type ReactNode } from 'react';
import { cn } from '@/lib/cn';
import { Button } from './button';
import { Icon } from './icon';

/**
 * A modal built on the native <dialog>: the browser traps focus, Escape closes it and focus returns
 * to whatever opened it.
 */
export function Dialog({
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

  return (
    <dialog
      ref={ref}
      onClose={onClose}
      aria-labelledby={titleId}
      aria-describedby={description ? descriptionId : undefined}
      className={cn(
        'm-auto w-[min(100%-1.5rem,34rem)] max-h-[calc(100dvh-1.5rem)] overflow-y-auto rounded-card border border-line bg-paper p-0 text-ink shadow-raised',
        'backdrop:bg-ink/60',
        className,
      )}
    >
      {isOpen ? (
        <div className="p-5 sm:p-6">
          <div className="mb-4 flex items-start justify-between gap-4">
            <div>
              <h2 id={titleId} className="text-xl font-bold">
                {title}
              </h2>
              {description ? (
                <div id={descriptionId} className="mt-1 text-ink-muted">
                  {description}
                </div>
              ) : null}
            </div>
            <Button variant="ghost" className="-mt-2 -mr-2 w-touch px-0" onClick={onClose} aria-label="Close">
              <Icon name="close" />
            </Button>
          </div>
          {children}
        </div>
      ) : null}
    </dialog>
  );
}

/** A yes/no question before something that is hard to undo. */
export function ConfirmDialog({
  isOpen,
  onClose,
  onConfirm,
  title,
  description,
  confirmLabel,
  tone = 'danger',
  isPending = false,
}: {
  isOpen: boolean;
  onClose: () => void;
  onConfirm: () => void;
  title: string;
  description: ReactNode;
  confirmLabel: string;
  tone?: 'danger' | 'primary';
  isPending?: boolean;
}) {
  return (
    <Dialog isOpen={isOpen} onClose={onClose} title={title} description={description}>
      <div className="mt-2 flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
        <Button variant="secondary" onClick={onClose} disabled={isPending}>
          Cancel
        </Button>
        <Button variant={tone} onClick={onConfirm} isPending={isPending}>
          {confirmLabel}
        </Button>
      </div>
    </Dialog>
  );
}
