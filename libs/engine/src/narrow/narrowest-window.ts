import { inputError } from '../errors';

/**
 * The k consecutive elements of a sorted list with the smallest spread: returns the start index
 * and the diameter. Any subset of an admissible set is admissible, so this turns a sieved set
 * into the narrowest k-tuple it contains.
 * @throws EngineError(input) when the list has fewer than k elements or k < 1.
 */
export function narrowestWindow(sorted: ArrayLike<number>, k: number): { start: number; diameter: number } {
  if (!Number.isSafeInteger(k) || k < 1) throw inputError(`k must be a positive integer, got ${k}`);
  if (sorted.length < k) throw inputError(`only ${sorted.length} elements, ${k} needed`);
  let start = 0;
  let diameter = Infinity;
  for (let i = 0; i + k - 1 < sorted.length; i++) {
    const span = sorted[i + k - 1] - sorted[i];
    if (span < diameter) {
      diameter = span;
      start = i;
    }
  }
  return { start, diameter };
}
