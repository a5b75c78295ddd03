import type { VerdictOutput } from './types';

/** Texts that may state the claim more broadly than its range: its cell's title, the notebook's notes. */
export interface VerdictContext {
  /** The claim cell's title, if any (the claim's own label is always looked at). */
  title?: string | null;
  /** The notebook's note texts. */
  notes?: readonly string[];
}

/** Integers of four or more digits grouped by threes with thin spaces (the glossary's one rule). */
export function groupInteger(n: number | bigint | string): string {
  const s = String(n);
  const m = /^(-?)(\d+)$/.exec(s);
  if (!m || m[2]!.length < 4) return s;
  return m[1]! + m[2]!.replace(/\B(?=(\d{3})+(?!\d))/g, '\u2009');
}

const count = (n: number, one: string, many: string) => `${groupInteger(n)} ${n === 1 ? one : many}`;

/**
 * Whether `text` says the claim holds more generally than the checked range: "for all p", "every
 * level", "always", "infinitely many", "∀ p" … (a quantifier over the bound names or over levels,
 * primes, tuples). "Every number below" or "settled for 10-tuples" do not count.
 */
export function statesMoreThanChecked(text: string, names: readonly string[], rangeEnds: readonly string[] = []): boolean {
  const vars = names.map((n) => n.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'));
  const things = ['levels?', 'primes?', 'wheel levels?', 'tuples?', 'k-tuples?', 'moduli', 'modulus', 'n', 'k', 'x', ...vars];
  const quantified = new RegExp(`(?:\\b(?:for all|for every|for each|for any|every|all|any)|∀)\\s*(?:admissible\\s+|odd\\s+|prime\\s+)?(?:${things.join('|')})(?![\\w'])`, 'iu');
  // Sentence by sentence: one that names the checked range's end ("all levels from 5 to 23") stays inside it.
  return text.split(/(?<=[.;!?])\s+/).some((sentence) => {
    if (rangeEnds.some((e) => new RegExp(`(?<![\\d])${e}(?![\\d])`).test(sentence))) return false;
    return quantified.test(sentence) || /\b(?:always|infinitely many|in general|for ever)\b/i.test(sentence);
  });
}

/**
 * A verdict in one sentence, saying exactly what was shown: for a claim that holds, the range as
 * written and that every case in it was checked (which proves the finite statement); where the
 * claim's name, its cell's title or a note states more than the range, that the broader statement
 * is not established. A failing claim gives its first counterexample.
 *
 * The output's own `summary` is kept as the interpreter recorded it (it is part of the digest that
 * locked notebooks re-verify); displays use this sentence instead.
 */
export function verdictSentence(v: VerdictOutput, context: VerdictContext = {}): string {
  if (!v.holds) return v.summary;
  if (!v.over) return 'holds (a statement without a range, checked once)';
  const left = v.skipped ? `; ${groupInteger(v.skipped)} left out by the conditions` : '';
  const cases = `${v.checked === 1 ? '1 case, checked' : `${groupInteger(v.checked)} cases, every case checked`}${left}`;
  const names = (v.first ?? []).map(([n]) => n);
  // The upper end only: a broader statement names its lower bound too ("for all p ≥ 5").
  const ends = (v.last ?? []).flatMap(([, x]) => (x.t === 'int' ? [x.v] : []));
  const broader: string[] = [];
  if ((v.label && statesMoreThanChecked(v.label, names, ends)) || (context.title && statesMoreThanChecked(context.title, names, ends))) broader.push("the claim's name");
  if ((context.notes ?? []).some((t) => statesMoreThanChecked(t, names, ends))) broader.push('a note');
  const beyond = broader.length
    ? `; ${broader.join(' and ')} ${broader.length > 1 ? 'state' : 'states'} more than this range, and that broader statement is not established`
    : '';
  return `holds for every ${v.over} (${cases})${beyond}`;
}
