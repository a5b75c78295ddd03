import { domainError, inputError } from '../errors';
import { admissibility, normalizeTuple } from '../tuple';
import { RESIDUES, RESIDUE_BIT } from './wheel30';

/** Largest pattern diameter the sieve accepts (the block boundary window grows with it). */
export const MAX_PATTERN_DIAMETER = 1_000_000;

/**
 * A constellation pattern prepared for the mod-30 sieve: for every start residue class c (bit of
 * the start byte) whose translates avoid 2, 3 and 5, the (byte offset, bit) of each n + h.
 */
export interface CompiledPattern {
  /** Normalized offsets: increasing, the first one 0. */
  readonly offsets: readonly number[];
  /** max H. */
  readonly diameter: number;
  /** Start classes (bit indices 0..7) that can carry an occurrence n ≥ 7. */
  readonly classes: readonly number[];
  /** For classes[i]: byte offsets of the terms, relative to the byte of n. */
  readonly termBytes: readonly Int32Array[];
  /** For classes[i]: bit index of each term inside its byte. */
  readonly termBits: readonly Int32Array[];
  /** Largest byte offset of any term. */
  readonly maxByteOffset: number;
  /** True for {0, 2} (a dedicated kernel counts twin primes). */
  readonly twin: boolean;
}

/**
 * Normalizes and checks a constellation pattern H for the sieve: integers, distinct, any order,
 * shifted to start at 0; H must be admissible and its diameter at most MAX_PATTERN_DIAMETER.
 * @throws EngineError(input) for a malformed pattern or a diameter above the limit;
 *   EngineError(domain) for a non-admissible pattern (naming the covering prime).
 */
export function compilePattern(values: ReadonlyArray<number | bigint | string>): CompiledPattern {
  const offsets = normalizeTuple(values);
  const diameter = offsets[offsets.length - 1]!;
  if (diameter > MAX_PATTERN_DIAMETER) {
    throw inputError(`pattern diameter ${diameter} is above the sieve limit ${MAX_PATTERN_DIAMETER}`);
  }
  const verdict = admissibility(offsets);
  if (!verdict.admissible) {
    const q = verdict.obstruction.prime;
    throw domainError(`pattern {${offsets.join(',')}} is not admissible: it covers every residue mod ${q}`);
  }
  const classes: number[] = [];
  const termBytes: Int32Array[] = [];
  const termBits: Int32Array[] = [];
  let maxByteOffset = 0;
  for (let c = 0; c < 8; c++) {
    const r = RESIDUES[c]!;
    const bytes = new Int32Array(offsets.length);
    const bits = new Int32Array(offsets.length);
    let ok = true;
    for (let i = 0; i < offsets.length; i++) {
      const v = r + offsets[i]!;
      const bit = RESIDUE_BIT[v % 30]!;
      if (bit < 0) {
        ok = false;
        break;
      }
      bytes[i] = Math.floor(v / 30);
      bits[i] = bit;
      if (bytes[i]! > maxByteOffset) maxByteOffset = bytes[i]!;
    }
    if (!ok) continue;
    classes.push(c);
    termBytes.push(bytes);
    termBits.push(bits);
  }
  const twin = offsets.length === 2 && offsets[1] === 2;
  return { offsets, diameter, classes, termBytes, termBits, maxByteOffset, twin };
}
