import { parseWorkspace } from '../io/workspace-schema';
import type { Workspace } from './workspace';

export const STORAGE_KEY = 'fall-line/workspace';

export interface KeyValueStorage {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
}

/**
 * The saved workspace, if there is a valid one. A stored workspace that no longer passes the schema is
 * kept under a side key (so nothing is silently thrown away) and reported.
 */
export function loadSavedWorkspace(storage: KeyValueStorage): { workspace: Workspace | null; problem: string | null } {
  const text = storage.getItem(STORAGE_KEY);
  if (text === null) return { workspace: null, problem: null };
  const parsed = parseWorkspace(text);
  if (parsed.ok) return { workspace: parsed.workspace, problem: null };
  storage.setItem(`${STORAGE_KEY}/unreadable`, text);
  return { workspace: null, problem: `The saved workspace could not be read (${parsed.error}); it was kept aside and the demo loaded instead.` };
}

/** Saves a workspace; returns an error message when the browser refuses (quota, private mode). */
export function saveWorkspace(storage: KeyValueStorage, workspace: Workspace): string | null {
  try {
    storage.setItem(STORAGE_KEY, JSON.stringify(workspace));
    return null;
  } catch (e) {
    return `The workspace could not be saved in this browser: ${(e as Error).message}`;
  }
}
