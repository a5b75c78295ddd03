import type { IRecognitionException, IToken } from 'chevrotain';
import { limitError, type SiftError, syntaxError, type SourceSpan } from '../errors';
import type { Program, Stmt } from './ast';
import { splitStatements, spanOfToken } from './layout';
import { DrawShapeError, siftParser } from './parser';
import { siftLexer } from './tokens';
import * as T from './tokens';

/** Largest cell source accepted, in characters (a bigger cell is refused with a limit error). */
export const MAX_SOURCE_LENGTH = 200_000;
/** Unary operators may stack this deep (`- - - x`, `not not p`). */
const MAX_PREFIX_RUN = 64;
/**
 * Digits a number literal may stand for: `1e10000000` is ten characters but would take seconds of
 * CPU to expand while parsing, before any run limit applies (also in the editor's diagnostics).
 */
export const MAX_LITERAL_DIGITS = 100_000;

export interface ParseResult {
  /** The statements that parsed; statements with errors are left out. */
  program: Program;
  /** Every syntax (and nesting-limit) error of the source, in source order. */
  errors: SiftError[];
}

/**
 * Parses a Sift cell. Never throws for bad input: lexing and parsing errors come back as data,
 * one or more per faulty statement, so that an editor can show them all at once.
 */
export function parse(source: string): ParseResult {
  if (source.length > MAX_SOURCE_LENGTH) {
    return {
      program: { statements: [] },
      errors: [limitError(`the cell has ${source.length} characters; at most ${MAX_SOURCE_LENGTH} are accepted`, { offset: 0, line: 1, column: 1, length: 0 })],
    };
  }
  const lexed = siftLexer.tokenize(source);
  const errors: SiftError[] = lexed.errors.map((e) =>
    syntaxError(`unexpected character '${source.slice(e.offset, e.offset + e.length)}'`, {
      offset: e.offset,
      line: e.line ?? 1,
      column: e.column ?? 1,
      length: e.length,
    }),
  );
  const split = splitStatements(lexed.tokens);
  errors.push(...split.errors);
  const statements: Stmt[] = [];
  const parser = siftParser();
  for (const tokens of split.statements) {
    const deep = prefixRun(tokens) ?? hugeLiteral(tokens);
    if (deep) {
      errors.push(deep);
      continue;
    }
    parser.input = tokens;
    let stmt: Stmt | undefined;
    try {
      stmt = parser.statement();
    } catch (e) {
      if (e instanceof DrawShapeError) {
        errors.push(syntaxError(e.message, e.span));
        continue;
      }
      if (e instanceof RangeError) {
        errors.push(limitError('the statement nests too deeply', spanOfToken(tokens[0]!)));
        continue;
      }
      throw e;
    }
    if (parser.errors.length > 0) {
      errors.push(toSyntaxError(parser.errors[0]!, tokens, source));
      continue;
    }
    if (stmt.t === 'claim') stmt.text = source.slice(stmt.span.offset, stmt.span.offset + stmt.span.length);
    statements.push(stmt);
  }
  errors.sort((a, b) => (a.span?.offset ?? 0) - (b.span?.offset ?? 0));
  return { program: { statements }, errors };
}

function prefixRun(tokens: IToken[]): SiftError | null {
  let run = 0;
  for (const t of tokens) {
    if (t.tokenType === T.Minus || t.tokenType === T.Not || t.tokenType === T.Caret) {
      if (++run > MAX_PREFIX_RUN) return limitError(`more than ${MAX_PREFIX_RUN} operators in a row`, spanOfToken(t));
    } else run = 0;
  }
  return null;
}

function hugeLiteral(tokens: IToken[]): SiftError | null {
  for (const t of tokens) {
    if (t.tokenType !== T.NumberLit) continue;
    const m = /^([\d_]+)(?:\.[\d_]+)?[eE]\+?(\d+)$/.exec(t.image);
    if (m && m[1]!.replace(/_/g, '').length + Number(m[2]) > MAX_LITERAL_DIGITS) {
      return limitError(`the literal ${t.image.length > 30 ? `${t.image.slice(0, 30)}…` : t.image} would have more than ${MAX_LITERAL_DIGITS} digits`, spanOfToken(t));
    }
  }
  return null;
}

function toSyntaxError(e: IRecognitionException, tokens: IToken[], source: string): SiftError {
  const tok = e.token;
  const atEnd = tok.tokenType.name === 'EOF' || !Number.isFinite(tok.startOffset);
  const last = tokens[tokens.length - 1]!;
  const span: SourceSpan = atEnd
    ? { offset: last.endOffset! + 1, line: last.endLine ?? last.startLine ?? 1, column: (last.endColumn ?? last.startColumn ?? 0) + 1, length: 0 }
    : spanOfToken(tok);
  return syntaxError(describe(e, atEnd ? null : tok.image, source), span);
}

function describe(e: IRecognitionException, found: string | null, _source: string): string {
  const where = found === null ? 'the statement ends too early' : `unexpected '${found}'`;
  switch (e.name) {
    case 'MismatchedTokenException': {
      const want = /Expecting token of type --> (\w+) <--/.exec(e.message)?.[1];
      return want ? `${where}: expected ${tokenWords(want)}` : where;
    }
    case 'NotAllInputParsedException':
      return `${where}: the statement is complete before it; put a new statement on its own line`;
    case 'NoViableAltException':
    case 'EarlyExitException':
      return `${where}: expected ${expectationOf(e)}`;
    default:
      return where;
  }
}

function expectationOf(e: IRecognitionException): string {
  const rule = e.context?.ruleStack?.[e.context.ruleStack.length - 1] ?? '';
  const byRule: Record<string, string> = {
    primary: 'a value (number, name, string, tuple {…}, series […], (…) or ∑/∏/∀/∃/#/table[…])',
    statement: 'a statement (let, claim, show, draw or an expression)',
    columnRef: 'a column name',
    binder: 'a binder such as p ∈ primes 5..29, or a condition',
    bigOperator: "'[' binders ']' followed by a body",
  };
  return byRule[rule] ?? byRule['primary']!;
}

const WORDS: Record<string, string> = {
  RParen: "')'", RBracket: "']'", RBrace: "'}'", LParen: "'('", Equals: "'='", Colon: "':'", Arrow: "'->' (or →)",
  Identifier: 'a name', StringLit: 'a string in double quotes', NumberLit: 'a number', Then: "'then'", Else: "'else'",
  DotDot: "'..'", In: "'in' (or ∈)", Name: 'a field name', LBracket: "'['",
};

function tokenWords(name: string): string {
  return WORDS[name] ?? `'${name.toLowerCase()}'`;
}
