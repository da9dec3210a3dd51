/**
 * The per-entry code of an elementwise gradient transform, for the sweep's fused kernel
 * (sweep/fused.ts), which inlines every transform of a chain into one generated loop over many runs.
 *
 * A transform that offers it writes, next to its `update`, the same operations on one entry in the
 * same order, as a statement over names the kernel chooses: the update entry `u` (read and
 * rewritten), the entry of the point before the step `p`, the transform's state entries `s[j]` (its
 * per-entry Float64Arrays, loaded into locals and stored back), constants `k[j]` fixed at build and
 * step numbers `q[j]` that `step(t)` computes once per step for every run (a bias correction, -lr_t).
 * Locals the code declares live in a block of its own (the kernel wraps each transform's code), and it
 * reads no other name. The text is ours (no user input reaches it); numbers pass as values, not as
 * source. The sweep's tests check every such code against `update` bit for bit.
 */
export interface LockstepCode {
  /** One entry per per-entry state array, in order: the value every entry starts at (`init`'s fill). */
  readonly arrays: readonly number[];
  /** The constants the code reads as k[0], k[1], ... */
  readonly constants: readonly number[];
  /** How many step numbers the code reads (q[0] ... q[steps - 1]). */
  readonly steps: number;
  /** Writes the step numbers for step t into out[at .. at + steps). */
  step?(t: number, out: Float64Array, at: number): void;
  /** The statements for one entry. */
  code(names: LockstepNames): string;
}

/** The names a transform's code reads and writes (locals of the generated kernel). */
export interface LockstepNames {
  u: string;
  p: string;
  s: readonly string[];
  k: readonly string[];
  q: readonly string[];
}
