import type { SiftToken, SiftTokenClass } from './sift-service';

/** Monaco token scopes for Sift token classes (the editor theme colours these). */
export const TOKEN_SCOPE: Record<SiftTokenClass, string> = {
  keyword: 'keyword.sift',
  identifier: 'identifier.sift',
  builtin: 'predefined.sift',
  number: 'number.sift',
  string: 'string.sift',
  comment: 'comment.sift',
  operator: 'operator.sift',
  punctuation: 'delimiter.sift',
};

/**
 * Monaco line tokens from service tokens of one line: every character gets a scope, gaps are
 * plain text. Sift has no token spanning lines, so lines are tokenised one at a time.
 */
export function lineTokens(line: string, tokens: SiftToken[]): Array<{ startIndex: number; scopes: string }> {
  const out: Array<{ startIndex: number; scopes: string }> = [];
  let at = 0;
  for (const t of [...tokens].sort((a, b) => a.offset - b.offset)) {
    if (t.offset >= line.length || t.offset < at) continue;
    if (t.offset > at) out.push({ startIndex: at, scopes: '' });
    out.push({ startIndex: t.offset, scopes: TOKEN_SCOPE[t.type] });
    at = t.offset + t.length;
  }
  if (at < line.length || out.length === 0) out.push({ startIndex: Math.min(at, line.length), scopes: '' });
  return out;
}
