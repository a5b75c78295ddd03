// `cribra admissible`: admissibility of a tuple with its witness or obstruction.
import { admissibility } from '@cribra/engine';
import type { Command } from '../command';
import { groupDigits, toJson, tupleText } from '../format';
import { parseFlags } from '../options';
import { tupleFromFlags } from '../tuple-input';

// The readable form lists the witness for the first primes only.
const SHOW_CLASSES = 12;

export const admissibleCommand: Command = {
  name: 'admissible',
  summary: 'is a tuple admissible? witness residues or the covering prime',
  usage: 'cribra admissible (--tuple 0,2,6,8,12 | --file FILE) [--json]',
  terms: ['tuple', 'admissible', 'obstruction'],
  async run(argv, io) {
    const flags = parseFlags(argv, { tuple: { type: 'string' }, file: { type: 'string' } });
    const values = tupleFromFlags(flags, 'tuple');
    const v = admissibility(values);
    if (v.admissible) {
      if (flags.json) io.out(toJson({ k: v.k, diameter: v.diameter, admissible: true, witness: v.witness }));
      else {
        const w = Object.entries(v.witness).map(([q, r]) => `${r} mod ${q}`);
        const shown = w.length > SHOW_CLASSES ? `${w.slice(0, SHOW_CLASSES).join(', ')}, … (${groupDigits(w.length)} primes; --json prints all)` : w.join(', ');
        io.out(`admissible ${groupDigits(v.k)}-tuple, diameter ${groupDigits(v.diameter)}\n`);
        io.out(`uncovered classes: ${w.length ? shown : 'none needed (k = 1)'}\n`);
      }
    } else if (flags.json) {
      // `covered` is kept for scripts; `residues` is the glossary's name (and Sift's).
      io.out(toJson({ k: v.k, diameter: v.diameter, admissible: false, obstruction: { ...v.obstruction, residues: v.obstruction.covered } }));
    } else {
      io.out(`not admissible: ${groupDigits(v.k)}-tuple, diameter ${groupDigits(v.diameter)}\n`);
      io.out(`obstruction: the tuple meets every residue class modulo ${v.obstruction.prime}: residues ${tupleText(v.obstruction.covered)}\n`);
    }
    return 0;
  },
};
