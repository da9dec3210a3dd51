/**
 * A 64-bit content fingerprint of an inline table (two independent 32-bit FNV-1a hashes over the
 * bits of every number, with different offsets), so a spec that arrives again as a fresh copy (from a
 * worker message or an experiment file) finds its parsed data in the cache without a deep comparison.
 * Not for security: a collision would need two different tables with the same name and shape.
 */
const bits = new Float64Array(1);
const words = new Uint32Array(bits.buffer);

export function fingerprintRows(rows: readonly (readonly number[])[]): string {
  let h1 = 0x811c9dc5;
  let h2 = 0x01000193 ^ 0x5bd1e995;
  for (let i = 0; i < rows.length; i++) {
    const row = rows[i];
    for (let j = 0; j < row.length; j++) {
      bits[0] = row[j];
      h1 = Math.imul(h1 ^ words[0], 0x01000193);
      h1 = Math.imul(h1 ^ words[1], 0x01000193);
      h2 = Math.imul(h2 ^ words[1], 0x01000193);
      h2 = Math.imul(h2 ^ words[0], 0x01000193);
    }
    h1 = Math.imul(h1 ^ row.length, 0x01000193);
    h2 = Math.imul(h2 ^ (row.length + 0x9e37), 0x01000193);
  }
  return `${(h1 >>> 0).toString(16).padStart(8, '0')}${(h2 >>> 0).toString(16).padStart(8, '0')}`;
}
