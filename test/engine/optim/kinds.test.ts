import { describe, expect, expectTypeOf, it } from 'vitest';
import { METHODS } from '../../../src/engine/optim/methods';
import type { OptimizerKind } from '../../../src/engine/optim/spec';

// OptimizerKind is written out in spec.ts (reading it from the registry would close an import cycle).
// This object must name every member of the union and no other (the compiler checks both), and the
// test compares it with the registry's kinds at run time: a kind added to one and not the other fails.
const UNION: { [K in OptimizerKind]: K } = {
  gd: 'gd',
  momentum: 'momentum',
  nesterov: 'nesterov',
  adagrad: 'adagrad',
  rmsprop: 'rmsprop',
  adam: 'adam',
  adamw: 'adamw',
  amsgrad: 'amsgrad',
  nadam: 'nadam',
  lbfgs: 'lbfgs',
  newton: 'newton',
  rule: 'rule',
};

describe('optimizer kinds', () => {
  it('the registry holds one method for each member of OptimizerKind and no other', () => {
    const registered = METHODS.map((m) => m.info.kind);
    expect(new Set(registered).size).toBe(registered.length);
    expect([...registered].sort()).toEqual(Object.values(UNION).sort());
    expectTypeOf<(typeof METHODS)[number]['info']['kind']>().toEqualTypeOf<OptimizerKind>();
  });
});
