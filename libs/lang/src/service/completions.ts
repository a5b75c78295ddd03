import '../builtins';
import { allBuiltins, builtin } from '../builtins/registry';
import { siftLexer } from '../syntax/tokens';
import { KEYWORD_DOCS, KEYWORDS } from './keywords';
import { tokenize } from './tokens';

export interface Completion {
  label: string;
  kind: 'function' | 'keyword' | 'variable' | 'option';
  /** Signature, e.g. `gapcount(g, p) → integer`. */
  detail: string;
  /** One line of documentation. */
  documentation: string;
  /** Text to insert (functions get an opening parenthesis). */
  insertText: string;
}

export interface HoverInfo {
  /** Markdown-free plain text: signature, then the doc line, then an example. */
  contents: string[];
  offset: number;
  length: number;
}

const WORD = /[A-Za-z_\u0391-\u03A9\u03B1-\u03C9][A-Za-z0-9_\u0391-\u03A9\u03B1-\u03C9']*$/;

/**
 * Completions at `offset` (0-based): the builtins with signatures, keywords, and the names the cell
 * defines (let, function parameters, binders), filtered by the word being typed. After `draw` the
 * chart kinds, after `log` the axes.
 */
export function complete(source: string, offset: number): Completion[] {
  const before = source.slice(0, offset);
  const prefix = WORD.exec(before)?.[0] ?? '';
  const prev = before.slice(0, before.length - prefix.length).trimEnd();
  const prevWord = /([A-Za-z]+)$/.exec(prev)?.[1];
  if (prevWord === 'draw') return ['line', 'scatter', 'bar'].filter((k) => k.startsWith(prefix)).map((k) => option(k, 'chart kind'));
  if (prevWord === 'log') return ['x', 'y', 'xy'].filter((k) => k.startsWith(prefix)).map((k) => option(k, 'logarithmic axis'));
  const out: Completion[] = [];
  for (const name of definedNames(source)) {
    if (name.startsWith(prefix) && name !== prefix) out.push({ label: name, kind: 'variable', detail: 'defined in this cell', documentation: '', insertText: name });
  }
  for (const b of allBuiltins()) {
    if (b.name.startsWith(prefix)) out.push({ label: b.name, kind: 'function', detail: b.signature, documentation: b.doc, insertText: `${b.name}(` });
  }
  for (const k of KEYWORDS) {
    if (k.startsWith(prefix)) out.push({ label: k, kind: 'keyword', detail: KEYWORD_DOCS[k]!.signature, documentation: KEYWORD_DOCS[k]!.doc, insertText: k });
  }
  return out;
}

function option(label: string, detail: string): Completion {
  return { label, kind: 'option', detail, documentation: '', insertText: label };
}

/** Names bound by let, by function parameters and by binders (x ∈ …). */
export function definedNames(source: string): string[] {
  const toks = siftLexer.tokenize(source).tokens;
  const names = new Set<string>();
  for (let i = 0; i < toks.length; i++) {
    const t = toks[i]!;
    if (t.tokenType.name !== 'Identifier') continue;
    const prev = toks[i - 1]?.tokenType.name;
    const next = toks[i + 1]?.tokenType.name;
    if (prev === 'Let' || next === 'In') names.add(t.image);
    if (prev === 'Let' && next === 'LParen') {
      for (let j = i + 2; j < toks.length && toks[j]!.tokenType.name !== 'RParen'; j++) {
        if (toks[j]!.tokenType.name === 'Identifier') names.add(toks[j]!.image);
      }
    }
  }
  return [...names].sort();
}

/** Hover text for the token at `offset`: builtins and keywords get their signature and doc, numbers their exact value. */
export function hover(source: string, offset: number): HoverInfo | null {
  const tok = tokenize(source).find((t) => offset >= t.offset && offset < t.offset + t.length);
  if (!tok) return null;
  const text = source.slice(tok.offset, tok.offset + tok.length);
  const span = { offset: tok.offset, length: tok.length };
  if (tok.kind === 'builtin') {
    const b = builtin(text)!;
    const old = b.aliasOf ? [`${text} is the old spelling of ${b.aliasOf}; it still runs as before`] : [];
    return { contents: [...old, b.signature, b.doc, `Example: ${b.example.source}  ⟶  ${b.example.result}`], ...span };
  }
  if (tok.kind === 'keyword' || text === '#') {
    const key = keywordKey(text);
    const k = key ? KEYWORD_DOCS[key] : undefined;
    return k ? { contents: [k.signature, k.doc], ...span } : null;
  }
  if (tok.kind === 'number') {
    const clean = text.replace(/_/g, '');
    if (/[eE.]/.test(clean)) return { contents: [`exact value ${exactText(clean)}`], ...span };
    return null;
  }
  if (tok.kind === 'name') {
    return definedNames(source).includes(text) ? { contents: [`${text}: defined in this cell`], ...span } : { contents: [`unknown name '${text}'`], ...span };
  }
  return null;
}

function keywordKey(text: string): string | null {
  const map: Record<string, string> = { '∑': 'sum', '∏': 'prod', '∀': 'all', '∃': 'any', '∈': 'in' };
  return map[text] ?? (KEYWORD_DOCS[text] ? text : null);
}

function exactText(image: string): string {
  const m = /^(\d+)(?:\.(\d+))?(?:[eE]\+?(\d+))?$/.exec(image);
  if (!m) return image;
  const frac = m[2] ?? '';
  const exp = Number(m[3] ?? 0) - frac.length;
  if (exp > 200) return `${m[1]}${frac} × 10^${exp}`;
  const digits = BigInt(m[1]! + frac);
  if (exp >= 0) return (digits * 10n ** BigInt(exp)).toString();
  const den = 10n ** BigInt(-exp);
  const g = gcd(digits, den);
  return `${digits / g}/${den / g}`;
}

function gcd(a: bigint, b: bigint): bigint {
  while (b) [a, b] = [b, a % b];
  return a;
}
