import '../builtins';
import { builtin } from '../builtins/registry';
import { siftLexer } from '../syntax/tokens';

export type TokenKind = 'keyword' | 'builtin' | 'name' | 'number' | 'string' | 'operator' | 'punctuation' | 'comment' | 'invalid';

/** A highlighted piece of source: 0-based offset, 1-based line and column, length in UTF-16 units. */
export interface SiftToken {
  offset: number;
  line: number;
  column: number;
  length: number;
  kind: TokenKind;
}

const KEYWORD_TYPES = new Set([
  'Let', 'Claim', 'Over', 'Show', 'Draw', 'As', 'Digits', 'If', 'Then', 'Else', 'And', 'Or', 'Not', 'Mod', 'Div',
  'True', 'False', 'Primes', 'In', 'Sum', 'Prod', 'All', 'Any', 'TableOp',
]);
const PUNCT = new Set(['Comma', 'Colon', 'LParen', 'RParen', 'LBracket', 'RBracket', 'LBrace', 'RBrace', 'Newline', 'Dot']);

/**
 * Tokens of a cell for syntax highlighting, in source order (comments included, unknown characters
 * as 'invalid'). Sift tokens never span lines, so an editor may also call this line by line.
 */
export function tokenize(source: string): SiftToken[] {
  const lexed = siftLexer.tokenize(source);
  const out: SiftToken[] = [];
  const all = [...lexed.tokens, ...((lexed.groups['comments'] ?? []) as typeof lexed.tokens)];
  for (const t of all) {
    const name = t.tokenType.name;
    if (name === 'Newline' && t.image === '\n') continue;
    let kind: TokenKind;
    if (name === 'Comment') kind = 'comment';
    else if (KEYWORD_TYPES.has(name)) kind = 'keyword';
    else if (name === 'Identifier') kind = builtin(t.image) ? 'builtin' : 'name';
    else if (name === 'NumberLit') kind = 'number';
    else if (name === 'StringLit') kind = 'string';
    else if (PUNCT.has(name)) kind = 'punctuation';
    else kind = 'operator';
    out.push({ offset: t.startOffset, line: t.startLine ?? 1, column: t.startColumn ?? 1, length: t.image.length, kind });
  }
  for (const e of lexed.errors) out.push({ offset: e.offset, line: e.line ?? 1, column: e.column ?? 1, length: e.length, kind: 'invalid' });
  return out.sort((a, b) => a.offset - b.offset);
}
