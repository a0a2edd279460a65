import { Button } from '@/components/ui/button';
import { useLibraryActions } from './library-actions-context';

/**
 * Edit, archive or unarchive, delete: for writers only; readers see nothing here. A datasheet in use
 * cannot be deleted (the API answers 409), so it offers Archive alone.
 */
export function LibraryRowActions<T extends { id: number; model: string; isArchived: boolean }>({ item, isInUse = false }: { item: T; isInUse?: boolean }) {
  const actions = useLibraryActions<T>();
  if (!actions.canWrite) return null;
  return (
    <div className="flex flex-wrap gap-2 md:flex-nowrap md:justify-end md:gap-1">
      <Button variant="secondary" onClick={() => actions.onEdit(item)}>
        Edit<span className="sr-only"> {item.model}</span>
      </Button>
      <Button variant="ghost" onClick={() => actions.onToggleArchived(item)} isPending={actions.pendingId === item.id}>
        {item.isArchived ? 'Unarchive' : 'Archive'}
        <span className="sr-only"> {item.model}</span>
      </Button>
      {isInUse ? null : (
        <Button variant="ghost" className="text-fail!" onClick={() => actions.onDelete(item)}>
          Delete<span className="sr-only"> {item.model}</span>
        </Button>
      )}
    </div>
  );
}
