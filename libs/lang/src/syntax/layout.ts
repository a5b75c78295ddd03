import type { IToken, TokenType } from 'chevrotain';
import { limitError, type SiftError, syntaxError } from '../errors';
import * as T from './tokens';

/** Brackets may nest this deep; deeper input is refused before parsing (no recursion overflow). */
export const MAX_NESTING = 64;

// A line break ends a statement unless the line ends with, or the next starts with, one of these.
const CONTINUES_AFTER = new Set<TokenType>([
  T.Plus, T.Minus, T.Times, T.Slash, T.Caret, T.Mod, T.Div, T.Equals, T.NotEq, T.Less, T.LessEq,
  T.Greater, T.GreaterEq, T.Approx, T.In, T.DotDot, T.Comma, T.Colon, T.Arrow, T.And, T.Or, T.Not,
  T.Let, T.Claim, T.Over, T.Show, T.Draw, T.If, T.Then, T.Else, T.Primes, T.As, T.Digits, T.Dot,
]);
const CONTINUES_BEFORE = new Set<TokenType>([
  T.Plus, T.Minus, T.Times, T.Slash, T.Caret, T.Mod, T.Div, T.Equals, T.NotEq, T.Less, T.LessEq,
  T.Greater, T.GreaterEq, T.Approx, T.DotDot, T.Comma, T.Arrow, T.And, T.Or, T.Over, T.Then,
  T.Else, T.As, T.Digits, T.Dot,
]);
const OPENERS = new Set<TokenType>([T.LParen, T.LBracket, T.LBrace]);
/** A line starting with one of these always starts a new statement (recovery from open brackets). */
const STATEMENT_STARTS = new Set<TokenType>([T.Let, T.Claim, T.Show, T.Draw]);
const CLOSERS = new Set<TokenType>([T.RParen, T.RBracket, T.RBrace]);

/**
 * Splits a token stream into statements: line breaks (and `;`) separate statements at bracket
 * depth 0; inside brackets and around operators they are ignored. Refuses nesting deeper than
 * MAX_NESTING with a limit error.
 */
export function splitStatements(tokens: IToken[]): { statements: IToken[][]; errors: SiftError[] } {
  const statements: IToken[][] = [];
  const errors: SiftError[] = [];
  let current: IToken[] = [];
  let depth = 0;
  const open: IToken[] = [];
  let tooDeep = false;
  for (let i = 0; i < tokens.length; i++) {
    const tok = tokens[i]!;
    const type = tok.tokenType;
    if (type === T.Newline) {
      const next = tokens[i + 1];
      const fresh = tok.image === '\n' && next !== undefined && STATEMENT_STARTS.has(next.tokenType);
      if (depth > 0 && fresh) {
        // let/claim/show/draw cannot continue an expression: the bracket was left open.
        const opener = open[open.length - 1]!;
        errors.push(syntaxError(`'${opener.image}' is never closed`, spanOfToken(opener)));
        depth = 0;
        open.length = 0;
        if (current.length > 0) statements.push(current);
        current = [];
        continue;
      }
      if (depth > 0) continue;
      const prev = current[current.length - 1];
      const explicit = tok.image === ';' || fresh;
      if (!explicit && prev && CONTINUES_AFTER.has(prev.tokenType)) continue;
      if (!explicit && prev && next && CONTINUES_BEFORE.has(next.tokenType)) continue;
      if (current.length > 0) statements.push(current);
      current = [];
      continue;
    }
    if (OPENERS.has(type)) {
      depth++;
      open.push(tok);
      if (depth > MAX_NESTING && !tooDeep) {
        tooDeep = true;
        errors.push(limitError(`brackets nest deeper than ${MAX_NESTING} levels`, spanOfToken(tok)));
      }
    } else if (CLOSERS.has(type)) {
      if (depth === 0) {
        errors.push(syntaxError(`unmatched '${tok.image}'`, spanOfToken(tok)));
        continue;
      }
      depth--;
      open.pop();
    }
    current.push(tok);
  }
  if (current.length > 0) statements.push(current);
  if (tooDeep) return { statements: [], errors };
  return { statements, errors };
}

export function spanOfToken(tok: IToken) {
  return { offset: tok.startOffset, line: tok.startLine ?? 1, column: tok.startColumn ?? 1, length: tok.image.length };
}
