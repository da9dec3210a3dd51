import { createHash } from 'node:crypto';
import type { Experiment } from '../io/experiment';

/**
 * A fingerprint of what an experiment computes: SHA-256 of the migrated file with its keys sorted, so
 * the same experiment saved with other spacing, key order or an older version hashes the same, and
 * shards of different files cannot be merged by mistake.
 */
export function experimentHash(experiment: Experiment): string {
  return `sha256:${createHash('sha256').update(canonicalJson(experiment)).digest('hex')}`;
}

function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value).filter(([, v]) => v !== undefined).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}
