import { createContext, useContext } from 'react';
import { useStore } from 'zustand';
import type { AppActions, AppState, AppStore } from '../store/app-store';

export const AppContext = createContext<AppStore | null>(null);

function useAppStore(): AppStore {
  const app = useContext(AppContext);
  if (!app) throw new Error('Fall Line components must be inside <AppContext.Provider>');
  return app;
}

/** Subscribes a component to one slice of the store (re-renders only when it changes). */
export function useApp<T>(selector: (s: AppState) => T): T {
  return useStore(useAppStore().store, selector);
}

export function useActions(): AppActions {
  return useAppStore().store.getState().actions;
}

/** Streamed trajectories, read by canvas layers outside React rendering. */
export function useLiveRuns() {
  return useAppStore().live;
}

/** The point under the pointer (store/hover-store.ts): for the hover readout; canvas loops use useHoverApi. */
export function useHover(): { a: number; b: number } | null {
  return useStore(useAppStore().hover, (s) => s.hover);
}

export function useHoverApi() {
  return useAppStore().hover;
}

export function useStoreApi() {
  return useAppStore().store;
}
