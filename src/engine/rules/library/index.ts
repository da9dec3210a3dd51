import { adadeltaRule } from './adadelta';
import { adabeliefRule } from './adabelief';
import { adamRule } from './adam';
import type { RuleExample } from './example';
import { heavyBallRule } from './heavyBall';
import { lionRule } from './lion';
import { rmspropRule } from './rmsprop';
import { signumRule } from './signum';

/** The rules shipped as examples and editor templates, in the order the page lists them. */
export const RULE_LIBRARY: readonly RuleExample[] = [adamRule, rmspropRule, heavyBallRule, adadeltaRule, lionRule, signumRule, adabeliefRule];

export function ruleExample(id: string): RuleExample | undefined {
  return RULE_LIBRARY.find((r) => r.id === id);
}

export type { RuleExample } from './example';
export { adamRule, rmspropRule, heavyBallRule, adadeltaRule, lionRule, signumRule, adabeliefRule };
