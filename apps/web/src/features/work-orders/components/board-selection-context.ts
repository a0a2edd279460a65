import type { WorkOrderListItem } from '@stringfield/shared';
import { createContext, use } from 'react';

/* Table columns live at module scope, so the row checkboxes reach the page's selection through context. */
export type BoardSelection = {
  selected: ReadonlyMap<number, WorkOrderListItem>;
  onToggle: (item: WorkOrderListItem, isSelected: boolean) => void;
  onTogglePage: (isSelected: boolean) => void;
  pageItems: readonly WorkOrderListItem[];
};

export const BoardSelectionContext = createContext<BoardSelection>({
  selected: new Map(),
  onToggle: () => undefined,
  onTogglePage: () => undefined,
  pageItems: [],
});

export function useBoardSelection(): BoardSelection {
  return use(BoardSelectionContext);
}
