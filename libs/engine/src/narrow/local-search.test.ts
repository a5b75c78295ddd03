import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { admissibility } from '../tuple';
import { greedyGreedySieve } from './greedy-greedy';
import { localSearch } from './local-search';
import { minimalDiameter } from './minimal-diameter';
import { bestOf, mergeTuples, narrowSearch, runSearchPiece, searchPieces } from './narrow-search';
import { narrowTuple } from './narrow-tuple';
import { schinzelSieveTuple } from './schinzel-sieve';
import { SieveState } from './sieve-state';

// H(k) for k = 1..56: OEIS A008407 (offset 2; a(1) = 0 stated in its comments) — the table of
// minimal-diameter.test.ts.
const A008407 = [
  0, 2, 6, 8, 12, 16, 20, 26, 30, 32, 36, 42, 48, 50, 56, 60, 66, 70, 76, 80, 84, 90, 94, 100, 110, 114, 120, 126,
  130, 136, 140, 146, 152, 156, 158, 162, 168, 176, 182, 186, 188, 196, 200, 210, 212, 216, 226, 236, 240, 246, 252,
  254, 264, 270, 272, 278,
];

/** The independent path: the tuple module's admissibility (not the narrow module's own check). */
function expectAdmissible(tuple: readonly number[], k: number): void {
  const v = admissibility(tuple);
  expect(v.admissible).toBe(true);
  expect(v.k).toBe(k);
}

describe('the sieve state keeps its counts incrementally', () => {
  it('cover counts and survivors after random moves equal a fresh build', () => {
    const primes = Int32Array.from([3, 5, 7, 11, 13]);
    const state = new SieveState(primes, -40, 60, Int32Array.from([0, 1, 2, 3, 4]));
    state.setWindow(5, 40);
    let seed = 7;
    for (let t = 0; t < 200; t++) {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      const j = seed % primes.length;
      const c = (seed >> 8) % primes[j];
      const expected = state.count - state.loss(j, c) + (c === state.offsets[j] ? 0 : state.gain(j));
      state.move(j, c);
      expect(state.count).toBe(expected);
      const fresh = new SieveState(primes, -40, 60, state.residues());
      fresh.setWindow(5, 40);
      expect(Array.from(state.cover)).toEqual(Array.from(fresh.cover));
      expect(state.survivors()).toEqual(fresh.survivors());
      // Survivors are the integers of the window avoiding every chosen class (checked directly).
      const direct: number[] = [];
      for (let i = 5; i < 45; i++) {
        const x = -40 + 2 * i;
        if (Array.from(primes).every((q, jj) => ((x % q) + q) % q !== state.residueOf(jj))) direct.push(x);
      }
      expect(state.survivors()).toEqual(direct);
    }
  });

  it('slides keep the survivor list equal to a fresh window', () => {
    const primes = Int32Array.from([3, 5, 7]);
    const state = new SieveState(primes, 0, 100, Int32Array.from([1, 2, 3]));
    state.setWindow(30, 20);
    for (const dir of [1, 1, -1, 1, -1, -1, -1, 1] as const) {
      const before = state.count;
      const delta = state.slideGain(dir);
      state.slide(dir);
      expect(state.count).toBe(before + delta);
      const fresh = new SieveState(primes, 0, 100, Int32Array.from([1, 2, 3]));
      fresh.setWindow(state.lo, 20);
      expect(state.survivors()).toEqual(fresh.survivors());
    }
  });
});

describe('localSearch', () => {
  it.each([150, 400, 1000])('returns an admissible tuple no wider than its start (k = %i)', (k) => {
    const start = schinzelSieveTuple(k);
    const r = localSearch(start.tuple, { steps: 20_000, seed: 3 });
    expect(r.k).toBe(k);
    expect(r.tuple).toHaveLength(k);
    expect(r.diameter).toBe(r.tuple[k - 1] - r.tuple[0]);
    expect(r.diameter).toBeLessThan(start.diameter); // Schinzel is far from optimal at these k
    expectAdmissible(r.tuple, k);
  });

  it('reports only strictly narrower admissible tuples while it runs', () => {
    const seen: number[] = [];
    const r = localSearch(schinzelSieveTuple(300).tuple, {
      steps: 20_000,
      onBest: (t) => {
        expectAdmissible(t.tuple, 300);
        seen.push(t.diameter);
      },
    });
    expect(seen.length).toBeGreaterThan(0);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeLessThan(seen[i - 1]);
    expect(seen[seen.length - 1]).toBe(r.diameter);
  });

  it('the same seed gives the same tuple', () => {
    const start = schinzelSieveTuple(200).tuple;
    expect(localSearch(start, { steps: 10_000, seed: 9 }).tuple).toEqual(localSearch(start, { steps: 10_000, seed: 9 }).tuple);
  });

  it('improves the greedy-greedy 34 429-tuple of the Polymath8 records (diameter 388 118) within a short budget', () => {
    // The anchor of constructions.test.ts; some ten thousand moves already narrow it.
    const gg = greedyGreedySieve({ from: -185662, to: 202456, fixedBound: 137 });
    const r = localSearch(gg.tuple, { steps: 30_000, seed: 3 });
    expect(r.diameter).toBeLessThan(388118);
    expectAdmissible(r.tuple, 34429);
  }, 120_000);

  it('stops on request with EngineError(limit), and refuses a non-admissible start', () => {
    let polls = 0;
    expect(() => localSearch(schinzelSieveTuple(100).tuple, { hooks: { shouldStop: () => ++polls > 2 } })).toThrow(/stopped on request/);
    expect(() => localSearch([0, 2, 4])).toThrow(EngineError);
  });

  it('timeUp ends the search normally with the best tuple so far', () => {
    let polls = 0;
    const start = schinzelSieveTuple(200);
    const r = localSearch(start.tuple, { steps: Number.MAX_SAFE_INTEGER, timeUp: () => ++polls > 20 });
    expect(r.diameter).toBeLessThanOrEqual(start.diameter);
    expectAdmissible(r.tuple, 200);
  });
});

describe('the search reaches the exact H(k) for small k without the exhaustive search', () => {
  // The pieces start from greedy-greedy seeds; the exhaustive search is switched off.
  it('k = 3 … 56 against OEIS A008407', () => {
    const missed: Array<[number, number, number]> = [];
    for (let k = 3; k <= 56; k++) {
      const h = A008407[k - 1];
      const r = narrowSearch(k, { exhaustive: false, pieces: 6, steps: 600_000, target: h });
      expect(r.exact).toBe(false);
      expectAdmissible(r.tuple, k);
      expect(r.diameter).toBeGreaterThanOrEqual(h); // never below the exact value
      if (r.diameter !== h) missed.push([k, r.diameter, h]);
    }
    expect(missed).toEqual([]);
  }, 300_000);

  it('k = 57 … 60 against the engine\'s exhaustive search (values not in the table above)', () => {
    for (let k = 57; k <= 60; k++) {
      const h = minimalDiameter(k).diameter;
      const r = narrowSearch(k, { exhaustive: false, pieces: 4, steps: 200_000, target: h });
      expectAdmissible(r.tuple, k);
      expect(r.diameter).toBe(h);
    }
  }, 300_000);
});

describe('narrowSearch and its pieces', () => {
  it('is exact for k ≤ 100 by default, and never wider than narrowTuple above', () => {
    expect(narrowSearch(20)).toMatchObject({ k: 20, diameter: 80, exact: true });
    for (const k of [120, 700]) {
      const base = narrowTuple(k);
      const r = narrowSearch(k, { steps: 30_000, pieces: 2 });
      expect(r.baseline).toBe(base.diameter);
      expect(r.diameter).toBeLessThanOrEqual(base.diameter);
      expectAdmissible(r.tuple, k);
    }
  }, 120_000);

  it('pieces are independent and reproducible; merging two results is admissible and no wider', () => {
    const pieces = searchPieces(300, 3);
    expect(new Set(pieces.map((p) => `${p.shift}/${p.bound}`)).size).toBe(3);
    const a = runSearchPiece(pieces[1], { steps: 10_000 });
    const b = runSearchPiece(pieces[2], { steps: 10_000 });
    expect(runSearchPiece(pieces[1], { steps: 10_000 }).tuple).toEqual(a.tuple);
    for (const t of [a, b]) expectAdmissible(t.tuple, 300);
    const best = bestOf([a, b]);
    const merged = mergeTuples(best.tuple, (best === a ? b : a).tuple, { steps: 5_000 });
    expect(merged.diameter).toBeLessThanOrEqual(best.diameter);
    expectAdmissible(merged.tuple, 300);
  }, 60_000);
});
