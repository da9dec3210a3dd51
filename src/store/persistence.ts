/**
 * The workspace in browser storage between visits. Storage is untrusted and may fail: it can be
 * missing or refused (privacy settings throw on access), hold text that is not a workspace, or be full.
 * None of these stops the page: each comes back as a message for the page's notice, and a saved
 * workspace that cannot be read is never overwritten before a copy of it is kept.
 */
import { parseWorkspace } from '../io/workspace-schema';
import type { Workspace } from './workspace';

export const STORAGE_KEY = 'fall-line/workspace';
export const UNREADABLE_KEY = `${STORAGE_KEY}/unreadable`;

export interface KeyValueStorage {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
}

export interface SavedWorkspace {
  workspace: Workspace | null;
  problem: string | null;
  /**
   * False when saving would destroy something: the stored text could not be read nor copied aside
   * (storage full), so it stays under its key until the user frees space and reloads.
   */
  saving: boolean;
}

/** The browser's storage, or null with the reason when the browser refuses access to it. */
export function openStorage(get: () => KeyValueStorage | null | undefined): { storage: KeyValueStorage | null; problem: string | null } {
  try {
    const storage = get();
    if (storage) return { storage, problem: null };
    return { storage: null, problem: 'This browser offers no storage for the page, so the workspace will not be kept after you close it.' };
  } catch (e) {
    return { storage: null, problem: `This browser refused the page its storage (${messageOf(e)}), so the workspace will not be kept after you close it.` };
  }
}

/**
 * The saved workspace, if there is a valid one. A stored workspace that no longer passes the schema is
 * kept under a side key (so nothing is silently thrown away) and reported.
 */
export function loadSavedWorkspace(storage: KeyValueStorage): SavedWorkspace {
  let text: string | null;
  try {
    text = storage.getItem(STORAGE_KEY);
  } catch (e) {
    return { workspace: null, problem: `The saved workspace could not be read from browser storage (${messageOf(e)}); the demo loaded instead and will not be saved over it.`, saving: false };
  }
  if (text === null) return { workspace: null, problem: null, saving: true };
  const parsed = parseWorkspace(text);
  if (parsed.ok) return { workspace: parsed.workspace, problem: null, saving: true };
  try {
    storage.setItem(UNREADABLE_KEY, text);
  } catch (e) {
    return {
      workspace: null,
      problem: `The saved workspace could not be read (${parsed.error}) nor kept aside (${messageOf(e)}); the demo loaded instead, and nothing will be saved until space is freed, so the old workspace is not overwritten.`,
      saving: false,
    };
  }
  return { workspace: null, problem: `The saved workspace could not be read (${parsed.error}); it was kept aside and the demo loaded instead.`, saving: true };
}

/** Saves a workspace; returns an error message when the browser refuses (quota, private mode). */
export function saveWorkspace(storage: KeyValueStorage, workspace: Workspace): string | null {
  try {
    storage.setItem(STORAGE_KEY, JSON.stringify(workspace));
    return null;
  } catch (e) {
    return `The workspace could not be saved in this browser: ${messageOf(e)}`;
  }
}

function messageOf(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}
