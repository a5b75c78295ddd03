import { describe, expect, it } from 'vitest';
import { siftService } from './lang-adapter';
import { lineTokens } from './monaco-tokens';

describe('the Sift language service as the editor sees it', () => {
  it('classes the tokens of a line for highlighting', () => {
    const line = 'let H = {0, 2, 6} // the triplet';
    const tokens = siftService.tokens(line);
    const at = (text: string) => tokens.find((t) => line.slice(t.offset, t.offset + t.length) === text)?.type;
    expect(at('let')).toBe('keyword');
    expect(at('H')).toBe('identifier');
    expect(at('6')).toBe('number');
    expect(at('// the triplet')).toBe('comment');
  });

  it('turns line tokens into Monaco scopes that cover the whole line', () => {
    const line = 'show admissible(H)';
    const scopes = lineTokens(line, siftService.tokens(line));
    expect(scopes[0]).toEqual({ startIndex: 0, scopes: 'keyword.sift' });
    expect(scopes.find((s) => s.startIndex === 5)?.scopes).toBe('predefined.sift');
    expect(scopes.map((s) => s.startIndex)).toEqual([...scopes.map((s) => s.startIndex)].sort((a, b) => a - b));
  });

  it('offers builtins with their signature while typing a name', () => {
    const items = siftService.completions('show admis', 10);
    const item = items.find((c) => c.label === 'admissible');
    expect(item?.kind).toBe('function');
    expect(item?.detail).toMatch(/admissible\(/);
    expect(item?.documentation).toBeTruthy();
  });

  it('reports a syntax error with its place in the source', () => {
    const source = 'let x = (1 + 2';
    const [d] = siftService.diagnostics(source);
    expect(d.severity).toBe('error');
    expect(d.start).toBeGreaterThanOrEqual(0);
    expect(d.end).toBeGreaterThan(d.start);
    expect(d.end).toBeLessThanOrEqual(source.length + 1);
  });

  it('explains a builtin on hover', () => {
    const h = siftService.hover('show admissible({0, 2})', 7);
    expect(h?.contents).toMatch(/admissible/);
    expect(h?.start).toBe(5);
    expect(h?.end).toBe(15);
  });
});
