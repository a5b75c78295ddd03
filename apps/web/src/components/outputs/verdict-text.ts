import { groupDigits } from '../../lib/format';
import type { VerdictOutput } from '../../lib/sift-output';
import { bindingText, valueText } from '../../lib/value-text';

/** The range a claim was checked on, in words: "p ∈ primes 5..29: 8 cases, from p = 5 to p = 29". */
export function checkedRangeText(v: VerdictOutput): string {
  const cases = `${groupDigits(v.checked)} case${v.checked === 1 ? '' : 's'} checked`;
  const skipped = v.skipped ? `, ${groupDigits(v.skipped)} left out by the conditions` : '';
  const span = v.first && v.last ? `, from ${bindingText(v.first)} to ${bindingText(v.last)}` : '';
  return `${v.over ? `${v.over}: ` : ''}${cases}${skipped}${span}`;
}

/** "lhs = 12 but rhs = 14" for a failed relation, or the bare value for a plain condition. */
export function counterexampleText(c: NonNullable<VerdictOutput['counterexample']>): string {
  if (!c.relation || !c.rhs) return `the condition is ${valueText(c.lhs)}`;
  return `left side ${valueText(c.lhs)}, right side ${valueText(c.rhs)}: “${c.relation}” does not hold`;
}
