import { SEGMENT_BUFFER, SEGMENT_BYTES } from './layout';
import { BYTE_CARRY, DELTA, firstCofactor, PRODUCT_MASK, PRODUCT_RESIDUE, TO_WHEEL_INDEX, TO_WHEEL_STEP } from './wheel30';

// The segment as a module constant (see SEGMENT_BUFFER: why not a parameter).
const BUF = new Uint8Array(SEGMENT_BUFFER);

/**
 * Bucket sieve for the large sieving primes: each waits in the bucket of the segment of its next
 * multiple as two small integers, its index and (byte offset in that segment)·8 + (wheel index of
 * its cofactor); a segment only touches the primes that hit it.
 */
export class LargePrimes {
  private readonly buckets: number[][];
  private activated: number;

  constructor(
    private readonly sieving: Uint32Array,
    from: number,
    private readonly to: number,
    private readonly totalBytes: number,
  ) {
    const maxStep = Math.floor(sieving[to - 1]! / 5) + 2; // q·6 + carry ≤ p/5 + 2 bytes
    this.buckets = Array.from({ length: Math.floor(maxStep / SEGMENT_BYTES) + 2 }, () => []);
    this.activated = from;
  }

  /** Crosses off the large primes' multiples in the segment (block byte `start` on). */
  crossSegment(base0: number, start: number, len: number, L: number): void {
    const buf = BUF;
    const segment = start / SEGMENT_BYTES;
    const base = base0 + 30 * start;
    const end = base + 30 * L;
    const sieving = this.sieving;
    const ring = this.buckets.length;
    // Start the primes whose square lies before the end of this segment.
    while (this.activated < this.to) {
      const p = sieving[this.activated]!;
      if (p * p >= end) break;
      let m = firstCofactor(p, base);
      const r = m - 30 * Math.floor(m / 30);
      m += TO_WHEEL_STEP[r]!;
      const w = TO_WHEEL_INDEX[r]!;
      const j = (p * m - base - PRODUCT_RESIDUE[8 * (p % 30) + w]!) / 30;
      if (start + j < this.totalBytes) {
        const d = Math.floor(j / SEGMENT_BYTES);
        this.buckets[(segment + d) % ring]!.push(this.activated, ((j - d * SEGMENT_BYTES) << 3) | w);
      }
      this.activated++;
    }
    const current = this.buckets[segment % ring]!;
    const last = start + len >= this.totalBytes;
    for (let t = 0; t < current.length; t += 2) {
      const i = current[t]!;
      const packed = current[t + 1]!;
      let j = packed >>> 3;
      let w = packed & 7;
      const p = sieving[i]!;
      const s = p % 30;
      const s8 = s << 3;
      const q = (p - s) / 30;
      while (j < len) {
        buf[j]! &= PRODUCT_MASK[s8 + w]!;
        j += q * DELTA[w]! + BYTE_CARRY[s8 + w]!;
        w = (w + 1) & 7;
      }
      if (last) continue; // past the block
      const d = (j / SEGMENT_BYTES) | 0;
      this.buckets[(segment + d) % ring]!.push(i, ((j - d * SEGMENT_BYTES) << 3) | w);
    }
    current.length = 0;
    if (L > len && !last) {
      // Look-ahead bytes [len, L): the hits of the primes waiting for the next segment (len = SEGMENT_BYTES).
      const following = this.buckets[(segment + 1) % ring]!;
      for (let t = 0; t < following.length; t += 2) {
        const i = following[t]!;
        const packed = following[t + 1]!;
        let j = (packed >>> 3) + len;
        let w = packed & 7;
        const p = sieving[i]!;
        const s = p % 30;
        const s8 = s << 3;
        const q = (p - s) / 30;
        while (j < L) {
          buf[j]! &= PRODUCT_MASK[s8 + w]!;
          j += q * DELTA[w]! + BYTE_CARRY[s8 + w]!;
          w = (w + 1) & 7;
        }
      }
    }
  }
}
