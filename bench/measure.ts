/**
 * Throughput measurement: run `op` in growing batches until a batch takes at least `minMs`, then take
 * the best of `rounds` batches of that size (the least disturbed by the other process sharing the CPU).
 * Each measurement gets its own freshly made timing loop, so the call site `op(k)` only ever sees one
 * function and the JIT can inline it as it would in real code (a shared loop would become megamorphic
 * and slow every measured function down by the same call overhead, hiding real differences).
 */
export function opsPerMs(op: (k: number) => number, minMs = 150, rounds = 5): number {
  // Bench-only code generation from a fixed string (no user input). Results are summed into a local and
  // handed to the sink once per batch, so the loop itself adds no memory traffic per operation.
  const loop = new Function(
    'op',
    'n',
    'let acc = 0; const t0 = performance.now(); for (let k = 0; k < n; k++) acc += op(k); const ms = performance.now() - t0; return [ms, acc];',
  ) as (op: (k: number) => number, n: number) => [number, number];
  const timeBatch = (f: (k: number) => number, n: number) => {
    const [ms, acc] = loop(f, n);
    sink.value += acc;
    return ms;
  };
  let n = 16;
  for (;;) {
    const t = timeBatch(op, n);
    if (t >= minMs) break;
    n = Math.ceil(n * Math.min(16, Math.max(2, (1.2 * minMs) / Math.max(t, 0.01))));
  }
  let best = 0;
  for (let r = 0; r < rounds; r++) best = Math.max(best, n / timeBatch(op, n));
  return best;
}

/**
 * Wall times in milliseconds of several calls measured in turn (f0, f1, ..., f0, f1, ...): the least
 * of `rounds` calls of each, for whole-grid or whole-sweep calls long enough that one call is a sound
 * sample. Two sides timed one after the other see different spells of this shared 2-core machine's
 * load (a slow spell of a second or two can halve one side only); taken in turn, both see the same.
 */
export function bestMsInTurn(fs: readonly (() => void)[], rounds = 7): number[] {
  const ms = fs.map(() => Infinity);
  for (let r = 0; r < rounds; r++)
    fs.forEach((f, i) => {
      const t0 = performance.now();
      f();
      ms[i] = Math.min(ms[i], performance.now() - t0);
    });
  return ms;
}

/** A value the optimiser cannot prove unused. */
export const sink = { value: 0 };
