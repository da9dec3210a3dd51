/** The experiment file's current version: the one the page writes and every older file is migrated to (versions.ts). */
export const CURRENT_VERSION = 3;
