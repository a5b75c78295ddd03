import { describe, expect, it } from 'vitest';
import {
  combineWheelChunks, levelFromQuadTally, levelQuadTally, levelQuadTallyChunk, patternsFromDense, planLevelQuadChunks,
  quadTallyRadix, wheelChunkTallyFromJson, wheelChunkTallyToJson, wheelLevelStats,
} from './index';

describe('quadruple tallies in chunks', () => {
  it('chunked (through JSON) equals the one-piece quadruple tally, for any cut', () => {
    for (const [q, count] of [[13, 5], [17, 17], [17, 3], [7, 2]] as const) {
      const radix = quadTallyRadix(q);
      const n = planLevelQuadChunks(q, count, radix).length;
      expect(n).toBe(count);
      const parts = Array.from({ length: n }, (_, i) => wheelChunkTallyFromJson(JSON.parse(JSON.stringify(wheelChunkTallyToJson(levelQuadTallyChunk(q, i, n, radix))))));
      const t = combineWheelChunks(parts);
      expect(patternsFromDense(t.patterns!, 4, t.radix + 1, t.radix)).toEqual(levelQuadTally(q));
    }
  });

  it('gives level p (histogram, largest gap, pair tally) equal to its direct enumeration', () => {
    for (const p of [11, 17, 19]) {
      const q = p === 11 ? 7 : p === 17 ? 13 : 17;
      const n = planLevelQuadChunks(q, 4).length;
      const quads = combineWheelChunks(Array.from({ length: n }, (_, i) => levelQuadTallyChunk(q, i, n)));
      const got = levelFromQuadTally(p, quads);
      const direct = wheelLevelStats(p, [2]);
      expect(got.histogram).toEqual(direct.histogram);
      expect(got.maxGap).toBe(direct.maxGap);
      expect(got.pairs).toEqual(direct.patterns.get(2));
    }
    // Jacobsthal values (largest gaps) of 17# and 19#: 26 and 34 (OEIS A048670; values from memory).
    expect(quadTallyRadix(17)).toBe(26 / 2 + 1);
    expect(quadTallyRadix(19)).toBe(34 / 2 + 1);
  });

  it('rejects a chunk that does not exist and a tally of the wrong level', () => {
    expect(() => levelQuadTallyChunk(13, 5, 5)).toThrow(/no quadruple chunk 5 of 5/);
    expect(() => planLevelQuadChunks(41, 2)).toThrow(/above the limit 37/);
    const quads = levelQuadTallyChunk(13, 0, 1);
    expect(() => levelFromQuadTally(19, quads)).toThrow(/needs the quadruples of 17#, got 13#/);
  });
});
