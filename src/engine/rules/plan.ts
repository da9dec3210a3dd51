import type { CheckedRule, Ref, StepStatement } from './ir';
import { reductionsIn, refsIn } from './ir';

/**
 * How the per-step statements are run. Statements are element-wise, so running each over all
 * parameters in turn gives the same numbers as running all of them for parameter 0, then all for
 * parameter 1, and so on: consecutive statements share one loop (a segment). A reduction reads every
 * parameter, so it is computed before its segment's loop; when it reads something an earlier
 * statement of the current segment assigns, a new segment starts at its statement, so it sees the
 * assigned values exactly as the in-order reading says.
 *
 * `let` values used only inside their own segment are plain numbers in the loop body; those read in a
 * later segment are kept in scratch arrays.
 */
export interface Segment {
  readonly statements: readonly StepStatement[];
}

export interface StepPlan {
  readonly segments: readonly Segment[];
  /** For each let value: whether it needs a scratch array. */
  readonly localInArray: readonly boolean[];
}

function key(ref: Ref): string {
  return ref.kind === 'state' || ref.kind === 'local' || ref.kind === 'hyper' ? `${ref.kind}${ref.index}` : ref.kind;
}

export function planSteps(rule: CheckedRule): StepPlan {
  const segments: StepStatement[][] = [];
  let current: StepStatement[] = [];
  let assigned = new Set<string>();
  for (const s of rule.steps) {
    const reads = reductionsIn(s.value).flatMap((r) => refsIn(r));
    if (current.length > 0 && reads.some((ref) => assigned.has(key(ref)))) {
      segments.push(current);
      current = [];
      assigned = new Set();
    }
    current.push(s);
    assigned.add(key(s.target));
  }
  if (current.length > 0) segments.push(current);

  const definedIn = new Array<number>(rule.localCount).fill(-1);
  const localInArray = new Array<boolean>(rule.localCount).fill(false);
  segments.forEach((segment, k) => {
    for (const s of segment) {
      for (const ref of refsIn(s.value)) if (ref.kind === 'local' && definedIn[ref.index] !== k) localInArray[ref.index] = true;
      // Reductions run before the loop, so even a same-segment let read by one would need an array;
      // the segment rule above already starts a new segment in that case.
      if (s.target.kind === 'local') definedIn[s.target.index] = k;
    }
  });
  return { segments: segments.map((statements) => ({ statements })), localInArray };
}
