import { createContext, use } from 'react';

/* Table columns live at module scope, so a row's buttons reach the page through context. */
export type LibraryActions<T> = {
  canWrite: boolean;
  onEdit: (item: T) => void;
  onToggleArchived: (item: T) => void;
  onDelete: (item: T) => void;
  /** The id whose archive change is on its way, to show a spinner on that row only. */
  pendingId: number | null;
};

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- one context serves both libraries; each table reads it with its own row type
export const LibraryActionsContext = createContext<LibraryActions<any>>({
  canWrite: false,
  onEdit: () => undefined,
  onToggleArchived: () => undefined,
  onDelete: () => undefined,
  pendingId: null,
});

export function useLibraryActions<T>(): LibraryActions<T> {
  return use(LibraryActionsContext) as LibraryActions<T>;
}
