import { allBuiltins, parse } from '@cribra/lang';
import type { SiftCompletion, SiftLanguageService } from './sift-service';

// Interim adapter over the public @cribra/lang surface (parser errors, builtin registry) until the
// language service module lands; then this file maps that service and nothing else changes.

const KEYWORDS = ['let', 'claim', 'over', 'show', 'draw', 'as', 'digits', 'if', 'then', 'else', 'and', 'or', 'not', 'in', 'primes', 'table'];

function wordAt(source: string, offset: number): { word: string; start: number; end: number } | null {
  const isWord = (ch: string | undefined) => !!ch && /[A-Za-z0-9_']/.test(ch);
  let start = offset;
  let end = offset;
  while (start > 0 && isWord(source[start - 1])) start--;
  while (end < source.length && isWord(source[end])) end++;
  return end > start ? { word: source.slice(start, end), start, end } : null;
}

export const siftService: SiftLanguageService = {
  tokens: () => [],
  completions(source, offset) {
    const prefix = (wordAt(source, offset)?.word ?? '').slice(0, Math.max(0, offset - (wordAt(source, offset)?.start ?? offset)));
    const fns: SiftCompletion[] = allBuiltins().map((b) => ({
      label: b.name,
      kind: 'function',
      detail: b.signature,
      documentation: `${b.doc}\n\nExample: \`${b.example.source}\` gives \`${b.example.result}\``,
    }));
    const kws: SiftCompletion[] = KEYWORDS.map((k) => ({ label: k, kind: 'keyword' }));
    return [...fns, ...kws].filter((c) => c.label.startsWith(prefix));
  },
  diagnostics(source) {
    return parse(source).errors.map((e) => ({
      message: e.message,
      severity: 'error' as const,
      start: e.span?.offset ?? 0,
      end: (e.span?.offset ?? 0) + Math.max(1, e.span?.length ?? 1),
    }));
  },
  hover(source, offset) {
    const w = wordAt(source, offset);
    if (!w) return null;
    const b = allBuiltins().find((x) => x.name === w.word);
    if (!b) return null;
    return { contents: `\`${b.signature}\`\n\n${b.doc}`, start: w.start, end: w.end };
  },
};
