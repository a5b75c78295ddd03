import type { WheelLevelSummary } from '@cribra/contracts';
import { describe, expect, it } from 'vitest';
import { nextLevelPrime } from './next-level';

const level = (prime: number) => ({ prime }) as WheelLevelSummary;

describe('nextLevelPrime', () => {
  it('starts at 2', () => expect(nextLevelPrime([])).toBe(2));
  // Primes after 23 and 113: 29 and 127 (OEIS A000040).
  it('takes the prime after the largest level', () => expect(nextLevelPrime([level(2), level(23), level(3)])).toBe(29));
  it('skips composites', () => expect(nextLevelPrime([level(113)])).toBe(127));
  it('offers a cancelled level again', () =>
    expect(nextLevelPrime([level(29), { prime: 31, status: 'cancelled' } as WheelLevelSummary])).toBe(31));
});
