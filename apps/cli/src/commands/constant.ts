// `cribra constant`: the Hardy–Littlewood singular series S(H) of an admissible pattern.
import { singularSeries } from '@cribra/engine';
import type { Command } from '../command';
import { toJson, tupleText } from '../format';
import { parseSmallInteger } from '../numbers';
import { parseFlags } from '../options';
import { tupleFromFlags } from '../tuple-input';

/** "1.3203…e+0" → "1.3203…" (plain notation while the exponent is moderate). */
export function plainDecimal(scientific: string): string {
  const m = /^(-?)(\d)(?:\.(\d+))?e([+-]\d+)$/.exec(scientific);
  if (!m) return scientific;
  const [, sign, lead, frac = '', expText] = m;
  const exp = Number(expText);
  if (exp < -6 || exp > 20) return scientific;
  const digits = lead! + frac;
  if (exp >= 0) {
    const int = digits.slice(0, exp + 1).padEnd(exp + 1, '0');
    const rest = digits.slice(exp + 1);
    return `${sign}${int}${rest ? `.${rest}` : ''}`;
  }
  return `${sign}0.${'0'.repeat(-exp - 1)}${digits}`;
}

export const constantCommand: Command = {
  name: 'constant',
  summary: 'the singular series S(H) of an admissible tuple (Hardy–Littlewood; S({0, 2}) = 2C₂)',
  usage: 'cribra constant (--tuple 0,2 | --pattern 0,2 | --file FILE) [--digits D] [--json]   (D from 1 to 30, default 20)',
  aliases: ['singular'],
  terms: ['tuple', 'singular series'],
  async run(argv, io) {
    const flags = parseFlags(argv, { pattern: { type: 'string' }, tuple: { type: 'string' }, file: { type: 'string' }, digits: { type: 'string' } });
    const values = tupleFromFlags(flags, 'pattern');
    const digits = typeof flags.digits === 'string' ? parseSmallInteger(flags.digits, '--digits', 1, 30) : 20;
    const s = singularSeries(values, { digits });
    const value = plainDecimal(s.decimal);
    if (flags.json) io.out(toJson({ pattern: s.pattern, k: s.k, value, digits: s.digits }));
    else io.out(`singular series S(${tupleText(s.pattern)}) = ${value}   (${s.digits} significant digits)\n`);
    return 0;
  },
};
