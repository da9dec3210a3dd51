import { createStore, type StoreApi } from 'zustand/vanilla';

/**
 * The slice point under the pointer, shared by every panel (linked hover), in a store of its own: it
 * changes on every pointer move, and only the overlay loops (which draw the crosshair) and the hover
 * readout read it, so a pointer move re-renders no panel of the map or the table.
 */
export interface HoverState {
  hover: { a: number; b: number } | null;
}

export function createHoverStore(): StoreApi<HoverState> {
  return createStore<HoverState>(() => ({ hover: null }));
}
