import { distance } from 'fastest-levenshtein';
import { allBuiltins, builtin, oldSpellings } from '../builtins/registry';

// Greek letters typed by their names: `pi` → `π`.
const GREEK: Record<string, string> = {
  alpha: 'α', beta: 'β', gamma: 'γ', delta: 'δ', epsilon: 'ε', zeta: 'ζ', eta: 'η', theta: 'θ', kappa: 'κ',
  lambda: 'λ', mu: 'μ', nu: 'ν', xi: 'ξ', pi: 'π', rho: 'ρ', sigma: 'σ', tau: 'τ', phi: 'φ', chi: 'χ', psi: 'ψ', omega: 'ω',
};

/** How many edits still read as a slip: none for one- and two-letter names (any letter is one edit away). */
function tolerance(length: number): number {
  if (length <= 2) return 0;
  if (length <= 4) return 1;
  if (length <= 7) return 2;
  return 3;
}

/**
 * The names `name` was most likely meant to be: the cell's own names (`own`) and the builtins
 * (an old spelling suggests its new name). At most two, nearest first; empty when nothing is close.
 */
export function suggestNames(name: string, own: Iterable<string>): string[] {
  const candidates = new Set<string>(own);
  for (const b of allBuiltins()) candidates.add(b.name);
  const greek = GREEK[name.toLowerCase()];
  if (greek && candidates.has(greek)) return [greek];
  const old = builtin(name)?.aliasOf;
  if (old) return [old];
  const limit = tolerance([...name].length);
  if (limit === 0) return [];
  const scored: Array<[string, number]> = [];
  const consider = (target: string, spelled: string) => {
    const d = Math.min(distance(name, spelled), distance(name.toLowerCase(), spelled.toLowerCase()) + 0.5);
    if (d <= limit && target !== name) scored.push([target, d]);
  };
  for (const c of candidates) consider(c, c);
  // A slip of an old spelling (`nextprim`) leads to the new name.
  for (const b of oldSpellings()) consider(b.aliasOf!, b.name);
  scored.sort((a, b) => a[1] - b[1] || a[0].localeCompare(b[0]));
  const out: string[] = [];
  for (const [c, d] of scored) {
    if (out.includes(c)) continue;
    if (out.length && d > scored[0]![1]) break;
    out.push(c);
    if (out.length === 2) break;
  }
  return out;
}

/** `; did you mean 'π'?` for an error message, or '' when nothing is close. */
export function didYouMean(name: string, own: Iterable<string>): string {
  const s = suggestNames(name, own);
  if (!s.length) return '';
  return `; did you mean ${s.map((n) => `'${n}'`).join(' or ')}?`;
}
