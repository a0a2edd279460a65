import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { isApiError } from '@/lib/api-client';

/**
 * Asks before deleting a datasheet. When the API refuses (409: still used), its message is shown as
 * it is ("used by N strings, archive it instead") with archiving offered in place of deleting.
 */
export function DeleteDatasheetDialog({
  name,
  isOpen,
  onClose,
  onDelete,
  onArchive,
  error,
  isDeleting,
  isArchived,
}: {
  name: string;
  isOpen: boolean;
  onClose: () => void;
  onDelete: () => void;
  onArchive: () => void;
  error: unknown;
  isDeleting: boolean;
  isArchived: boolean;
}) {
  const isInUse = isApiError(error) && error.status === 409;
  return (
    <Dialog isOpen={isOpen} onClose={onClose} title={`Delete ${name}?`} description="Deleting removes the datasheet from the library for good. Only an unused datasheet can be deleted.">
      <div className="flex flex-col gap-4">
        <div aria-live="assertive" className="empty:hidden">
          {error ? (
            <Alert tone={isInUse ? 'attention' : 'fail'} title={isInUse ? 'Still in use' : 'Not deleted'}>
              {error instanceof Error ? error.message : 'Something went wrong.'}
            </Alert>
          ) : null}
        </div>
        <div className="flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
          <Button variant="secondary" onClick={onClose} disabled={isDeleting}>
            Cancel
          </Button>
          {isInUse && !isArchived ? (
            <Button variant="primary" onClick={onArchive}>
              Archive instead
            </Button>
          ) : null}
          {isInUse ? null : (
            <Button variant="danger" onClick={onDelete} isPending={isDeleting}>
              Delete
            </Button>
          )}
        </div>
      </div>
    </Dialog>
  );
}
