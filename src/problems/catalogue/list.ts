import { ackley, ackleyPoints } from './ackley';
import { beale } from './beale';
import { booth } from './booth';
import { easom } from './easom';
import { goldsteinPrice } from './goldstein-price';
import { himmelblau } from './himmelblau';
import { levy13 } from './levy13';
import { matyas } from './matyas';
import { mccormick } from './mccormick';
import { plateau, plateauPoints } from './plateau';
import { quadratic, quadraticPoints, rotatedQuadratic } from './quadratics';
import { rastrigin, rastriginPoints } from './rastrigin';
import { rosenbrock, rosenbrockPoints } from './rosenbrock';
import { saddle } from './saddle';
import { sixHumpCamel } from './six-hump-camel';
import { styblinskiTang } from './styblinski-tang';
import { threeHumpCamel } from './three-hump-camel';
import type { CatalogueEntry, KnownPoint, KnownPointsRule } from './types';

/** Freezes an entry and everything in it, so no caller can change the shared catalogue data. */
function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const inner of Object.values(value)) deepFreeze(inner);
  }
  return value;
}

/** Every catalogue surface, in the order a picker shows them (deeply frozen). */
export const CATALOGUE: readonly CatalogueEntry[] = deepFreeze([
  quadratic,
  rotatedQuadratic,
  saddle,
  plateau,
  rosenbrock,
  himmelblau,
  beale,
  booth,
  matyas,
  threeHumpCamel,
  sixHumpCamel,
  goldsteinPrice,
  rastrigin,
  ackley,
  levy13,
  styblinskiTang,
  mccormick,
  easom,
]);

/** Entries whose known points move or change curvature with their constants. */
const RULES: Readonly<Record<string, KnownPointsRule>> = {
  [quadratic.id]: quadraticPoints,
  [rotatedQuadratic.id]: quadraticPoints,
  [plateau.id]: plateauPoints,
  [rosenbrock.id]: rosenbrockPoints,
  [rastrigin.id]: rastriginPoints,
  [ackley.id]: ackleyPoints,
};

const BY_ID = new Map(CATALOGUE.map((e) => [e.id, e]));

export function catalogueIds(): string[] {
  return CATALOGUE.map((e) => e.id);
}

/** The entry with this id; throws, listing the known ids, when there is none. */
export function catalogueEntry(id: string): CatalogueEntry {
  const entry = BY_ID.get(id);
  if (!entry) throw new Error(`catalogue: no surface with id '${id}'; known ids: ${catalogueIds().join(', ')}`);
  return entry;
}

/**
 * The entry's constants with `overrides` applied. Throws on a name the formula does not have or a
 * value that is not a finite number, e.g. `catalogue rosenbrock: unknown constant 'c'; constants: a, b`.
 */
export function resolveConstants(entry: CatalogueEntry, overrides?: Readonly<Record<string, number>>): Record<string, number> {
  const merged: Record<string, number> = { ...(entry.constants ?? {}) };
  const known = Object.keys(merged);
  for (const [name, value] of Object.entries(overrides ?? {})) {
    if (!(name in merged)) {
      const list = known.length ? `constants: ${known.join(', ')}` : 'it has no constants';
      throw new Error(`catalogue ${entry.id}: unknown constant '${name}'; ${list}`);
    }
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      throw new Error(`catalogue ${entry.id}: constant ${name} must be a finite number, got ${String(value)}`);
    }
    merged[name] = value;
  }
  return merged;
}

/**
 * Known points for the given constants (defaults where not given). For entries without constants, or
 * with the default constants, this is `entry.knownPoints`. Where the constants leave no isolated
 * stationary point (e.g. Rosenbrock with b <= 0) the list is empty.
 */
export function knownPointsFor(entry: CatalogueEntry, constants?: Readonly<Record<string, number>>): KnownPoint[] {
  if (!constants || Object.keys(constants).length === 0) return entry.knownPoints;
  const resolved = resolveConstants(entry, constants);
  const rule = RULES[entry.id];
  return rule ? rule(resolved) : entry.knownPoints;
}
