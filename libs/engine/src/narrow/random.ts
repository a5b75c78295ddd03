/**
 * A small seeded pseudo-random generator (32-bit state, "mulberry32" mixing) for the randomized
 * narrow-tuple search: the same seed gives the same search, so results and tests are repeatable.
 * Not for cryptography.
 */
export class SearchRandom {
  private state: number;
  constructor(seed: number) {
    this.state = seed >>> 0;
  }
  /** A uniform float in [0, 1). */
  next(): number {
    let t = (this.state = (this.state + 0x6d2b79f5) >>> 0);
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  }
  /** A uniform integer in [0, n). */
  below(n: number): number {
    return Math.floor(this.next() * n);
  }
}
