import { admissibility, coveredResidues, isAdmissible, isSmallPrime, normalizeTuple, occupancy, tupleDiameter } from '@cribra/engine';
import { domainError } from '../errors';
import { SiftRecord, Table, Tuple } from '../values/types';
import { argSmall, argTuple, type Builtin, defineBuiltins } from './registry';

const tuples: Builtin[] = [
  {
    name: 'admissible', area: 'tuples', minArgs: 1, maxArgs: 1,
    signature: 'admissible(H) → boolean',
    doc: 'Whether H misses at least one residue class modulo every prime.',
    example: { source: 'admissible({0, 2, 6, 8, 12})', result: 'true' },
    call: (a, c) => isAdmissible(argTuple(a, 0, c, 'admissible')),
  },
  {
    name: 'admissibility', area: 'tuples', minArgs: 1, maxArgs: 1,
    signature: 'admissibility(H) → record (admissible, k, diameter, prime, residues)',
    doc: 'The verdict with its evidence: for an admissible H the witness table, otherwise the covering prime and its classes.',
    example: { source: 'admissibility({0, 2, 4})', result: '(admissible: false, k: 3, diameter: 4, prime: 3, residues: {0, 1, 2})' },
    call: (a, c) => {
      const v = admissibility(argTuple(a, 0, c, 'admissibility'));
      if (v.admissible) {
        return SiftRecord.of([
          ['admissible', true], ['k', BigInt(v.k)], ['diameter', BigInt(v.diameter)],
          ['witness', witnessTable(v.witness)],
        ]);
      }
      return SiftRecord.of([
        ['admissible', false], ['k', BigInt(v.k)], ['diameter', BigInt(v.diameter)],
        ['prime', BigInt(v.obstruction.prime)], ['residues', new Tuple(v.obstruction.covered.map(BigInt))],
      ]);
    },
  },
  {
    name: 'witness', area: 'tuples', minArgs: 1, maxArgs: 1,
    signature: 'witness(H) → table (prime, residue)',
    doc: 'For an admissible H: for each prime q ≤ k the least residue mod q that H (shifted to start at 0) misses.',
    example: { source: 'witness({0, 2, 6})', result: 'table (prime, residue): (2, 1), (3, 1)' },
    call: (a, c) => {
      const v = admissibility(argTuple(a, 0, c, 'witness'));
      if (!v.admissible) throw domainError(`witness: the tuple is not admissible (it covers every class mod ${v.obstruction.prime})`, c.span);
      return witnessTable(v.witness);
    },
  },
  {
    name: 'obstruction', area: 'tuples', minArgs: 1, maxArgs: 1,
    signature: 'obstruction(H) → record (prime, residues)',
    doc: 'For a non-admissible H: the least prime whose every residue class H meets.',
    example: { source: 'obstruction({0, 2, 4})', result: '(prime: 3, residues: {0, 1, 2})' },
    call: (a, c) => {
      const v = admissibility(argTuple(a, 0, c, 'obstruction'));
      if (v.admissible) throw domainError('obstruction: the tuple is admissible; it has no obstruction', c.span);
      return SiftRecord.of([['prime', BigInt(v.obstruction.prime)], ['residues', new Tuple(v.obstruction.covered.map(BigInt))]]);
    },
  },
  {
    name: 'occupancy', area: 'tuples', minArgs: 1, maxArgs: 2,
    signature: 'occupancy(H, q) → integer  |  occupancy(H) → table (prime, occupied, free)',
    doc: 'ν_q(H), the number of residue classes mod the prime q met by H; without q, the table for every prime q ≤ k.',
    example: { source: 'occupancy({0, 2, 6, 8, 12}, 5)', result: '4' },
    call: (a, c) => {
      const h = normalizeTuple(argTuple(a, 0, c, 'occupancy'));
      if (a.length === 2) return BigInt(occupancy(h, argSmall(a, 1, c, 'occupancy', 2, 2 ** 31 - 1)));
      const rows: bigint[][] = [];
      for (let q = 2; q <= Math.max(2, h.length); q++) {
        if (!isSmallPrime(q)) continue;
        c.tick();
        const nu = occupancy(h, q);
        rows.push([BigInt(q), BigInt(nu), BigInt(q - nu)]);
      }
      return new Table(['prime', 'occupied', 'free'], rows);
    },
  },
  {
    name: 'covered', area: 'tuples', minArgs: 2, maxArgs: 2,
    signature: 'covered(H, q) → tuple',
    doc: 'The residues mod the prime q that H (shifted to start at 0) meets, increasing.',
    example: { source: 'covered({0, 2, 6, 8}, 3)', result: '{0, 2}' },
    call: (a, c) => new Tuple(coveredResidues(normalizeTuple(argTuple(a, 0, c, 'covered')), argSmall(a, 1, c, 'covered', 2, 2 ** 31 - 1)).map(BigInt)),
  },
  {
    name: 'diameter', area: 'tuples', minArgs: 1, maxArgs: 1,
    signature: 'diameter(H) → integer', doc: 'max H − min H.',
    example: { source: 'diameter({0, 2, 6, 8, 12})', result: '12' },
    call: (a, c) => {
      const h = argTuple(a, 0, c, 'diameter');
      if (h.length === 0) throw domainError('diameter: the tuple is empty', c.span);
      return h.length < 2 ? 0n : BigInt(tupleDiameter(normalizeTuple(h)));
    },
  },
  {
    name: 'normalize', area: 'tuples', minArgs: 1, maxArgs: 1,
    signature: 'normalize(H) → tuple', doc: 'H shifted to start at 0 (admissibility and counts do not change).',
    example: { source: 'normalize({11, 13, 17})', result: '{0, 2, 6}' },
    call: (a, c) => new Tuple(normalizeTuple(argTuple(a, 0, c, 'normalize')).map(BigInt)),
  },
];

function witnessTable(w: Readonly<Record<number, number>>): Table {
  return new Table(['prime', 'residue'], Object.keys(w).map(Number).sort((x, y) => x - y).map((q) => [BigInt(q), BigInt(w[q]!)]));
}

defineBuiltins(tuples);
