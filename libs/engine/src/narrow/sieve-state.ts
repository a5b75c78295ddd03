/**
 * The working state of the local search: one residue class chosen per odd prime q ≤ k, sieved out
 * of the integers of one parity in a buffer, and a window of the buffer whose survivors are counted.
 * Every set of survivors is admissible by construction (each prime q ≤ k misses its chosen class;
 * the parity class misses the other one), so the search never tests admissibility: it only counts.
 *
 * Integers are x = base + 2i for buffer indices i ∈ [0, size); for a prime q the chosen class is
 * stored as the index offset c (the indices i ≡ c mod q), so sieving and counting stride by q.
 * Everything the moves need is kept incrementally (this is the profile's hot spot for large k):
 * - cover[i]: how many primes' chosen classes contain index i (a survivor has cover 0);
 * - the sorted list of survivors inside the window.
 * A move changes one prime's class and updates only the indices of the two classes involved.
 */
export class SieveState {
  /** Cover counts per buffer index. */
  readonly cover: Uint16Array;
  /** Chosen class (index offset in [0, q)) per prime. */
  readonly offsets: Int32Array;
  /** Window [lo, lo + width) in buffer indices. */
  lo = 0;
  width = 0;
  /** Survivors in the window, sorted (first `count` entries). */
  surv: Int32Array;
  count = 0;
  private spare: Int32Array;
  private readonly added: Int32Array;
  private readonly removed: Int32Array;
  private counts: Int32Array;

  constructor(
    /** Odd primes q ≤ k, increasing. */
    readonly primes: Int32Array,
    /** Even or odd integer standing for buffer index 0 (the parity of every survivor). */
    readonly base: number,
    readonly size: number,
    /** Chosen classes as residues of the integers x in [0, q). */
    residues: Int32Array,
  ) {
    this.cover = new Uint16Array(size);
    this.offsets = new Int32Array(primes.length);
    for (let j = 0; j < primes.length; j++) this.offsets[j] = this.offsetOf(j, residues[j]);
    for (let j = 0; j < primes.length; j++) {
      const q = primes[j];
      for (let i = this.offsets[j]; i < size; i += q) this.cover[i]++;
    }
    this.surv = new Int32Array(size);
    this.spare = new Int32Array(size);
    const largest = primes.length ? primes[primes.length - 1] : 1;
    this.added = new Int32Array(Math.ceil(size / 3) + 2);
    this.removed = new Int32Array(Math.ceil(size / 3) + 2);
    this.counts = new Int32Array(largest + 1);
  }

  /** Index offset of the class of integers ≡ r (mod q_j): base + 2i ≡ r ⇔ i ≡ (r − base)·2⁻¹. */
  offsetOf(j: number, r: number): number {
    const q = this.primes[j];
    const inv2 = (q + 1) / 2;
    const d = (((r - this.base) % q) + q) % q;
    return (d * inv2) % q; // below 2^31 for q ≤ 50 000
  }

  /** The chosen class of prime j as a residue of the integers x in [0, q). */
  residueOf(j: number): number {
    const q = this.primes[j];
    return ((((this.base + 2 * this.offsets[j]) % q) + q) % q);
  }

  /** Integer at buffer index i. */
  at(i: number): number {
    return this.base + 2 * i;
  }

  /** Put the window at [lo, lo + width) (inside the buffer) and list its survivors. */
  setWindow(lo: number, width: number): void {
    this.lo = lo;
    this.width = width;
    let n = 0;
    const end = lo + width;
    for (let i = lo; i < end; i++) if (this.cover[i] === 0) this.surv[n++] = i;
    this.count = n;
  }

  /** First index ≥ the window start in class c mod q. */
  private firstIn(c: number, q: number): number {
    let r = (this.lo - c) % q;
    if (r < 0) r += q;
    return r === 0 ? this.lo : this.lo + (q - r);
  }

  /** Survivors the window gains when prime j gives up its class: indices there covered by j alone. */
  gain(j: number): number {
    const q = this.primes[j];
    const end = this.lo + this.width;
    let g = 0;
    for (let i = this.firstIn(this.offsets[j], q); i < end; i += q) if (this.cover[i] === 1) g++;
    return g;
  }

  /**
   * Change in the number of window indices covered exactly once if prime j moved to class c
   * (a tie-break for moves that keep the survivor count: indices covered once are the ones a
   * later move can free).
   */
  onceDelta(j: number, c: number): number {
    const q = this.primes[j];
    const end = this.lo + this.width;
    const cover = this.cover;
    let d = 0;
    for (let i = this.firstIn(this.offsets[j], q); i < end; i += q) {
      const v = cover[i];
      if (v === 2) d++;
      else if (v === 1) d--;
    }
    for (let i = this.firstIn(c, q); i < end; i += q) {
      const v = cover[i];
      if (v === 0) d++;
      else if (v === 1) d--;
    }
    return d;
  }

  /** Survivors of the window in class c mod q_j (what moving prime j to c would remove). */
  loss(j: number, c: number): number {
    const q = this.primes[j];
    const end = this.lo + this.width;
    let l = 0;
    for (let i = this.firstIn(c, q); i < end; i += q) if (this.cover[i] === 0) l++;
    return l;
  }

  /**
   * Survivors of the window per class mod q_j, in one pass over the survivor list (residues walk
   * along the gaps, no division while gaps stay below q). The returned array is reused.
   */
  classCounts(j: number): Int32Array {
    const q = this.primes[j];
    const counts = this.counts;
    counts.fill(0, 0, q);
    const s = this.surv;
    const n = this.count;
    if (n === 0) return counts;
    let r = s[0] % q;
    let prev = s[0];
    for (let t = 0; t < n; t++) {
      const g = s[t] - prev;
      prev = s[t];
      r += g < q ? g : g % q;
      if (r >= q) r -= q;
      counts[r]++;
    }
    return counts;
  }

  /** Move prime j's class to offset c: update cover counts and the survivor list of the window. */
  move(j: number, c: number): void {
    const q = this.primes[j];
    const old = this.offsets[j];
    if (c === old) return;
    const cover = this.cover;
    const lo = this.lo;
    const end = lo + this.width;
    let na = 0;
    let nr = 0;
    for (let i = old; i < this.size; i += q) {
      if (--cover[i] === 0 && i >= lo && i < end) this.added[na++] = i;
    }
    for (let i = c; i < this.size; i += q) {
      if (cover[i]++ === 0 && i >= lo && i < end) this.removed[nr++] = i;
    }
    this.offsets[j] = c;
    if (na === 0 && nr === 0) return;
    // Merge: survivors minus `removed` plus `added`, all three sorted.
    const s = this.surv;
    const out = this.spare;
    let a = 0;
    let r = 0;
    let n = 0;
    for (let t = 0; t < this.count; t++) {
      const x = s[t];
      while (a < na && this.added[a] < x) out[n++] = this.added[a++];
      if (r < nr && this.removed[r] === x) {
        r++;
        continue;
      }
      out[n++] = x;
    }
    while (a < na) out[n++] = this.added[a++];
    this.spare = s;
    this.surv = out;
    this.count = n;
  }

  /** Change in the survivor count if the window slid by one index (dir = +1 right, −1 left); NaN at the buffer's edge. */
  slideGain(dir: 1 | -1): number {
    const end = this.lo + this.width;
    if (dir === 1) return end >= this.size ? NaN : (this.cover[end] === 0 ? 1 : 0) - (this.cover[this.lo] === 0 ? 1 : 0);
    return this.lo === 0 ? NaN : (this.cover[this.lo - 1] === 0 ? 1 : 0) - (this.cover[end - 1] === 0 ? 1 : 0);
  }

  /** Slide the window by one index (the caller checked {@link slideGain} is a number). */
  slide(dir: 1 | -1): void {
    const s = this.surv;
    if (dir === 1) {
      if (this.cover[this.lo] === 0) {
        s.copyWithin(0, 1, this.count);
        this.count--;
      }
      this.lo++;
      const last = this.lo + this.width - 1;
      if (this.cover[last] === 0) s[this.count++] = last;
    } else {
      const last = this.lo + this.width - 1;
      if (this.cover[last] === 0) this.count--;
      this.lo--;
      if (this.cover[this.lo] === 0) {
        s.copyWithin(1, 0, this.count);
        s[0] = this.lo;
        this.count++;
      }
    }
  }

  /** Survivors (as integers) of the window. */
  survivors(): number[] {
    return Array.from(this.surv.subarray(0, this.count), (i) => this.base + 2 * i);
  }

  /** Chosen classes as residues of the integers, per prime. */
  residues(): Int32Array {
    const out = new Int32Array(this.primes.length);
    for (let j = 0; j < this.primes.length; j++) out[j] = this.residueOf(j);
    return out;
  }
}
