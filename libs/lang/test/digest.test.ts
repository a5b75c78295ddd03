import { createHash } from 'node:crypto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { canonicalJson, evaluate, outputsDigest, sha256Hex, sha256HexOfText, type SiftOutput } from '../src';

describe('SHA-256 in plain TypeScript', () => {
  it('matches the FIPS 180-4 examples', () => {
    expect(sha256HexOfText('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(sha256HexOfText('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
    expect(sha256HexOfText('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe('248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1');
  });

  it('matches node:crypto on random byte strings (every padding length)', () => {
    fc.assert(fc.property(fc.uint8Array({ maxLength: 300 }), (bytes) => {
      expect(sha256Hex(bytes)).toBe(createHash('sha256').update(bytes).digest('hex'));
    }), { numRuns: 400 });
  });
});

describe('canonical JSON', () => {
  it('sorts keys, drops undefined, writes numbers in shortest form and bigints as strings', () => {
    expect(canonicalJson({ b: 1, a: [1.5, -0, 1e21, undefined], c: undefined, d: 10n ** 30n, e: 'é"' })).toBe(
      '{"a":[1.5,0,1e+21,null],"b":1,"d":"1000000000000000000000000000000","e":"é\\""}',
    );
  });

  it('refuses non-finite numbers', () => {
    expect(() => canonicalJson({ x: Infinity })).toThrow('non-finite');
  });

  it('does not depend on key insertion order', () => {
    expect(canonicalJson({ x: 1, y: { b: 2, a: 3 } })).toBe(canonicalJson({ y: { a: 3, b: 2 }, x: 1 }));
  });
});

const CELL = `let H = {0, 2, 6, 8, 12}
show admissible(H) as "admissible"
table[p ∈ primes 5..19](level: p, hits: hits(H, p), sixes: gapcount(6, p))
show ∑[n ∈ 1..30] 1/n
show singular({0, 2})
claim gapcount(6, p) = closedform(6, p) over p ∈ primes 5..23
draw line table[p ∈ primes 5..19](level: p, n: gapcount(2, p)): level -> n log y`;

describe('digest of outputs', () => {
  it('is stable across runs', () => {
    const a = evaluate(CELL);
    const b = evaluate(CELL);
    expect(a.error).toBeNull();
    expect(a.digest).toMatch(/^[0-9a-f]{64}$/);
    expect(b.digest).toBe(a.digest);
    expect(outputsDigest(a.outputs)).toBe(a.digest);
  });

  it('is the SHA-256 of the canonical JSON of {digest: 1, outputs}', () => {
    const r = evaluate('show 2^70 as "x"');
    const canonical = canonicalJson({ digest: 1, outputs: r.outputs });
    expect(canonical).toBe('{"digest":1,"outputs":[{"kind":"value","label":"x","text":"1180591620717411303424","value":{"t":"int","v":"1180591620717411303424"}}]}');
    expect(r.digest).toBe(createHash('sha256').update(canonical, 'utf8').digest('hex'));
  });

  it('changes when any output changes', () => {
    const base: SiftOutput[] = [{ kind: 'value', label: null, value: { t: 'int', v: '1' }, text: '1' }];
    const other: SiftOutput[] = [{ kind: 'value', label: null, value: { t: 'int', v: '2' }, text: '2' }];
    expect(outputsDigest(base)).not.toBe(outputsDigest(other));
    expect(outputsDigest([])).toBe(sha256HexOfText('{"digest":1,"outputs":[]}'));
  });
});
