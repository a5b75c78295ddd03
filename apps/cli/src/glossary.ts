// The glossary's terms as the command line uses them (docs/glossary.md is the full glossary; a test
// checks that every term here is defined there and shown in the help).

export interface GlossaryTerm {
  term: string;
  /** One line, as in docs/glossary.md. */
  meaning: string;
}

export const CLI_TERMS: readonly GlossaryTerm[] = [
  { term: 'tuple', meaning: 'a set H = {h1, …, hk} of distinct integer offsets, written 0,2,6 on the command line and {0, 2, 6} in output' },
  { term: 'admissible', meaning: 'a tuple that misses some residue class modulo every prime' },
  { term: 'obstruction', meaning: 'the least prime whose every residue class the tuple meets, with those residues' },
  { term: 'wheel level', meaning: 'the integers in [1, p#] coprime to p# (its members; φ(p#) of them)' },
  { term: 'hits', meaning: 'x in one period [1, p#] with x + h coprime to p# for every h of the tuple' },
  { term: 'constellation', meaning: 'an n with n + h prime for every h of the tuple' },
  { term: 'record gap', meaning: 'a gap between consecutive primes larger than every earlier one' },
  { term: 'largest gap', meaning: 'one number; for a level it is the Jacobsthal value j(p#)' },
  { term: 'singular series', meaning: 'S(H) of Hardy–Littlewood; S({0, 2}) = 2C₂, twice the twin prime constant' },
  { term: 'range', meaning: '--from A --to N is A..N, both ends included' },
];

/** `--help` lines for some terms: "  tuple — …". */
export function termLines(terms: readonly string[]): string[] {
  return terms.map((t) => {
    const g = CLI_TERMS.find((x) => x.term === t);
    if (!g) throw new Error(`no glossary term '${t}'`);
    return `  ${g.term} — ${g.meaning}`;
  });
}
