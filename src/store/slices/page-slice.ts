/** Live page state that is not saved: the notice, the results table's columns and sort. */
import type { PageActions } from '../app-state';
import type { SliceContext } from './context';

export function pageSlice({ get, set }: SliceContext): PageActions {
  return {
    dismissNotice() {
      set({ notice: null });
    },
    setTableColumns(columns) {
      set({ table: { ...get().table, columns: columns ? [...columns] : null } });
    },
    setTableSort(sort) {
      set({ table: { ...get().table, sort } });
    },
  };
}
