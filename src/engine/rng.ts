/**
 * Seeded pseudo-random numbers whose whole state is one plain object, so a run's randomness can be
 * saved, sent to a worker and resumed with identical results.
 *
 * Generator: mulberry32 (Tommy Ettinger, public domain; a 32-bit state with a full 2^32 period),
 * enough for gradient noise, shuffling and random directions; not for cryptography.
 * Gaussians use the Box-Muller transform (Box and Muller, Ann. Math. Statist. 29, 1958).
 */
export interface RngState {
  s: number;
  /** Second Box-Muller deviate, kept for the next call (NaN when none is waiting). */
  spare: number;
}

export function createRng(seed: number): RngState {
  if (!Number.isFinite(seed)) throw new Error(`rng: seed must be a finite number, got ${seed}`);
  return { s: (Math.trunc(seed) ^ 0x9e3779b9) >>> 0, spare: Number.NaN };
}

/** Uniform in [0, 1). */
export function nextUniform(r: RngState): number {
  r.s = (r.s + 0x6d2b79f5) >>> 0;
  let t = r.s;
  t = Math.imul(t ^ (t >>> 15), t | 1);
  t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
  return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
}

/** Standard normal deviate. */
export function nextGaussian(r: RngState): number {
  if (!Number.isNaN(r.spare)) {
    const z = r.spare;
    r.spare = Number.NaN;
    return z;
  }
  let u = 0;
  while (u === 0) u = nextUniform(r);
  const v = nextUniform(r);
  const radius = Math.sqrt(-2 * Math.log(u));
  r.spare = radius * Math.sin(2 * Math.PI * v);
  return radius * Math.cos(2 * Math.PI * v);
}

/** Integer in [0, n). */
export function nextInt(r: RngState, n: number): number {
  return Math.floor(nextUniform(r) * n);
}

/** Fisher-Yates shuffle in place (Knuth, TAOCP vol. 2, Algorithm P). */
export function shuffleInPlace(r: RngState, a: Int32Array | number[]): void {
  for (let i = a.length - 1; i > 0; i--) {
    const j = nextInt(r, i + 1);
    const tmp = a[i];
    a[i] = a[j];
    a[j] = tmp;
  }
}
