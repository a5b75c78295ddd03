import type { VerdictOutput } from '../../lib/sift-output';
import { valueText } from '../../lib/value-text';

/** "lhs = 12 but rhs = 14" for a failed relation, or the bare value for a plain condition. */
export function counterexampleText(c: NonNullable<VerdictOutput['counterexample']>): string {
  if (!c.relation || !c.rhs) return `the condition is ${valueText(c.lhs)}`;
  return `left side ${valueText(c.lhs)}, right side ${valueText(c.rhs)}: “${c.relation}” does not hold`;
}
