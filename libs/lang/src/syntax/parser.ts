import { EmbeddedActionsParser, type IToken, tokenMatcher, type TokenType } from 'chevrotain';
import type { SourceSpan } from '../errors';
import { Rational } from '../values/rational';
import type { ArithOp, BigOp, Binder, ChartKind, CompareOp, Expr, Stmt } from './ast';
import * as T from './tokens';

const NO_SPAN: SourceSpan = { offset: 0, line: 1, column: 1, length: 0 };

/** Span from the first character of `a` to the last character of `b`. */
export function spanOf(a: IToken, b: IToken = a): SourceSpan {
  const end = (b.endOffset ?? b.startOffset) + 1;
  if (!Number.isFinite(a.startOffset)) return NO_SPAN;
  return { offset: a.startOffset, line: a.startLine ?? 1, column: a.startColumn ?? 1, length: Math.max(0, end - a.startOffset) };
}

function join(a: SourceSpan, b: SourceSpan): SourceSpan {
  return { ...a, length: Math.max(a.length, b.offset + b.length - a.offset) };
}

const COMPARE: Record<string, CompareOp> = {
  Equals: '=', NotEq: '≠', Less: '<', LessEq: '≤', Greater: '>', GreaterEq: '≥', Approx: '≈', In: '∈',
};
const ARITH: Record<string, ArithOp> = { Plus: '+', Minus: '-', Times: '*', Slash: '/', Mod: 'mod', Div: 'div' };
const BIG: Record<string, BigOp> = { Sum: 'sum', Prod: 'prod', All: 'all', Any: 'any', Hash: 'count', TableOp: 'table' };

/** Decimal literal → exact value: `12`, `1_000`, `1e9` are integers, `0.25` is the rational 1/4. */
export function numberValue(image: string): bigint | Rational {
  const clean = image.replace(/_/g, '');
  const m = /^(\d+)(?:\.(\d+))?(?:[eE]\+?(\d+))?$/.exec(clean);
  if (!m) return 0n;
  const frac = m[2] ?? '';
  const exp = m[3] ? Number(m[3]) : 0;
  const digits = BigInt(m[1]! + frac);
  const scale = exp - frac.length;
  return scale >= 0 ? digits * 10n ** BigInt(scale) : Rational.of(digits, 10n ** BigInt(-scale));
}

/**
 * The Sift grammar, one statement at a time (the layout pass splits a cell into statements, so a
 * syntax error in one statement never hides the diagnostics of the next).
 */
class SiftParser extends EmbeddedActionsParser {
  constructor() {
    super(T.allTokens, { maxLookahead: 2, recoveryEnabled: false });
    this.performSelfAnalysis();
  }

  private end(): IToken {
    return this.LA(0);
  }

  public statement = this.RULE('statement', (): Stmt => {
    return this.OR([
      { ALT: () => this.SUBRULE(this.letStmt) },
      { ALT: () => this.SUBRULE(this.claimStmt) },
      { ALT: () => this.SUBRULE(this.showStmt) },
      { ALT: () => this.SUBRULE(this.drawStmt) },
      {
        ALT: () => {
          const value = this.SUBRULE(this.expression);
          return this.ACTION(() => ({ t: 'expr', value, span: value.span }) as Stmt);
        },
      },
    ]);
  });

  private letStmt = this.RULE('letStmt', (): Stmt => {
    const start = this.CONSUME(T.Let);
    const name = this.CONSUME(T.Identifier);
    let params: string[] | null = null;
    this.OPTION(() => {
      this.CONSUME(T.LParen);
      params = [];
      this.MANY_SEP({ SEP: T.Comma, DEF: () => params!.push(this.CONSUME2(T.Identifier).image) });
      this.CONSUME(T.RParen);
    });
    this.CONSUME(T.Equals);
    const value = this.SUBRULE(this.expression);
    return this.ACTION(() => ({ t: 'let', name: name.image, params, value, span: spanOf(start, this.end()) }));
  });

  private claimStmt = this.RULE('claimStmt', (): Stmt => {
    const start = this.CONSUME(T.Claim);
    let label: string | null = null;
    this.OPTION({
      GATE: () => this.LA(2).tokenType === T.Colon,
      DEF: () => {
        label = this.OR([
          { ALT: () => { const tok = this.CONSUME(T.StringLit); return this.ACTION(() => unquote(tok.image)); } },
          { ALT: () => this.CONSUME(T.Identifier).image },
        ]);
        this.CONSUME(T.Colon);
      },
    });
    const body = this.SUBRULE(this.expression);
    let binders: Binder[] = [];
    this.OPTION2(() => {
      this.CONSUME(T.Over);
      binders = this.SUBRULE(this.binders);
    });
    return this.ACTION(() => ({ t: 'claim', label, body, binders, text: '', span: spanOf(start, this.end()) }));
  });

  private showStmt = this.RULE('showStmt', (): Stmt => {
    const start = this.CONSUME(T.Show);
    const value = this.SUBRULE(this.expression);
    let label: string | null = null;
    let digits: number | null = null;
    this.MANY(() => {
      this.OR([
        { ALT: () => { this.CONSUME(T.As); const tok = this.CONSUME(T.StringLit); label = this.ACTION(() => unquote(tok.image)); } },
        { ALT: () => { this.CONSUME(T.Digits); const tok = this.CONSUME(T.NumberLit); digits = this.ACTION(() => Number(tok.image.replace(/_/g, ''))); } },
      ]);
    });
    return this.ACTION(() => ({ t: 'show', value, label, digits, span: spanOf(start, this.end()) }));
  });

  private drawStmt = this.RULE('drawStmt', (): Stmt => {
    const start = this.CONSUME(T.Draw);
    const kindTok = this.CONSUME(T.Identifier);
    const source = this.SUBRULE(this.expression);
    this.CONSUME(T.Colon);
    const x = this.SUBRULE(this.columnRef);
    this.CONSUME(T.Arrow);
    const ys: string[] = [];
    this.AT_LEAST_ONE_SEP({ SEP: T.Comma, DEF: () => ys.push(this.SUBRULE2(this.columnRef)) });
    const opts: { word: IToken; arg: IToken }[] = [];
    let title: string | null = null;
    this.MANY(() => {
      this.OR([
        { ALT: () => opts.push({ word: this.CONSUME2(T.Identifier), arg: this.CONSUME3(T.Identifier) }) },
        { ALT: () => { this.CONSUME(T.As); const tok = this.CONSUME(T.StringLit); title = this.ACTION(() => unquote(tok.image)); } },
      ]);
    });
    return this.ACTION((): Stmt => {
      const kind = kindTok.image as ChartKind;
      if (!['line', 'scatter', 'bar'].includes(kind)) {
        throw new DrawShapeError(`'${kindTok.image}' is not a chart kind; write line, scatter or bar`, spanOf(kindTok));
      }
      let logX = false;
      let logY = false;
      for (const o of opts) {
        if (o.word.image !== 'log' || !['x', 'y', 'xy'].includes(o.arg.image)) {
          throw new DrawShapeError(`unknown chart option '${o.word.image} ${o.arg.image}'; options are 'log x', 'log y', 'log xy' and 'as "title"'`, spanOf(o.word, o.arg));
        }
        if (o.arg.image.includes('x')) logX = true;
        if (o.arg.image.includes('y')) logY = true;
      }
      return { t: 'draw', kind, source, x, ys, logX, logY, title, span: spanOf(start, this.end()) };
    });
  });

  private columnRef = this.RULE('columnRef', (): string => {
    return this.OR([
      { ALT: () => this.CONSUME(T.Name).image },
      { ALT: () => { const tok = this.CONSUME(T.StringLit); return this.ACTION(() => unquote(tok.image)); } },
    ]);
  });

  private binders = this.RULE('binders', (): Binder[] => {
    const out: Binder[] = [];
    this.AT_LEAST_ONE_SEP({ SEP: T.Comma, DEF: () => out.push(this.SUBRULE(this.binder)) });
    return out;
  });

  private binder = this.RULE('binder', (): Binder => {
    return this.OR([
      {
        GATE: () => this.LA(2).tokenType === T.In,
        ALT: () => {
          const name = this.CONSUME(T.Identifier);
          this.CONSUME(T.In);
          const domain = this.SUBRULE(this.expression);
          return this.ACTION((): Binder => ({ t: 'bind', name: name.image, domain, span: join(spanOf(name), domain.span) }));
        },
      },
      {
        ALT: () => {
          const cond = this.SUBRULE2(this.expression);
          return this.ACTION((): Binder => ({ t: 'filter', cond, span: cond.span }));
        },
      },
    ]);
  });

  public expression = this.RULE('expression', (): Expr => {
    return this.OR([
      {
        ALT: () => {
          const start = this.CONSUME(T.If);
          const cond = this.SUBRULE(this.expression);
          this.CONSUME(T.Then);
          const then = this.SUBRULE2(this.expression);
          this.CONSUME(T.Else);
          const otherwise = this.SUBRULE3(this.expression);
          return this.ACTION((): Expr => ({ t: 'if', cond, then, otherwise, span: spanOf(start, this.end()) }));
        },
      },
      { ALT: () => this.SUBRULE(this.orExpr) },
    ]);
  });

  private orExpr = this.RULE('orExpr', (): Expr => this.logicChain(T.Or, 'or', () => this.SUBRULE(this.andExpr), () => this.SUBRULE2(this.andExpr)));
  private andExpr = this.RULE('andExpr', (): Expr => this.logicChain(T.And, 'and', () => this.SUBRULE(this.notExpr), () => this.SUBRULE2(this.notExpr)));

  private logicChain(tok: TokenType, op: 'and' | 'or', first: () => Expr, next: () => Expr): Expr {
    const items = [first()];
    this.MANY(() => {
      this.CONSUME(tok);
      items.push(next());
    });
    return this.ACTION(() => (items.length === 1 ? items[0]! : { t: 'logic', op, items, span: join(items[0]!.span, items[items.length - 1]!.span) }));
  }

  private notExpr = this.RULE('notExpr', (): Expr => {
    return this.OR([
      {
        ALT: () => {
          const start = this.CONSUME(T.Not);
          const arg = this.SUBRULE(this.notExpr);
          return this.ACTION((): Expr => ({ t: 'not', arg, span: join(spanOf(start), arg.span) }));
        },
      },
      { ALT: () => this.SUBRULE(this.compareExpr) },
    ]);
  });

  private compareExpr = this.RULE('compareExpr', (): Expr => {
    const first = this.SUBRULE(this.rangeExpr);
    const rest: { op: CompareOp; rhs: Expr; span: SourceSpan }[] = [];
    this.MANY(() => {
      const opTok = this.OR([
        { ALT: () => this.CONSUME(T.Equals) },
        { ALT: () => this.CONSUME(T.NotEq) },
        { ALT: () => this.CONSUME(T.Less) },
        { ALT: () => this.CONSUME(T.LessEq) },
        { ALT: () => this.CONSUME(T.Greater) },
        { ALT: () => this.CONSUME(T.GreaterEq) },
        { ALT: () => this.CONSUME(T.Approx) },
        { ALT: () => this.CONSUME(T.In) },
      ]);
      const rhs = this.SUBRULE2(this.rangeExpr);
      this.ACTION(() => rest.push({ op: COMPARE[opTok.tokenType.name]!, rhs, span: spanOf(opTok) }));
    });
    return this.ACTION(() => (rest.length === 0 ? first : { t: 'compare', first, rest, span: join(first.span, rest[rest.length - 1]!.rhs.span) }));
  });

  private rangeExpr = this.RULE('rangeExpr', (): Expr => {
    return this.OR([
      {
        ALT: () => {
          const start = this.CONSUME(T.Primes);
          const lo = this.SUBRULE(this.additive);
          this.CONSUME(T.DotDot);
          const hi = this.SUBRULE2(this.additive);
          return this.ACTION((): Expr => ({ t: 'range', lo, hi, primes: true, span: join(spanOf(start), hi.span) }));
        },
      },
      {
        ALT: () => {
          const lo = this.SUBRULE3(this.additive);
          let hi: Expr | null = null;
          this.OPTION(() => {
            this.CONSUME2(T.DotDot);
            hi = this.SUBRULE4(this.additive);
          });
          return this.ACTION((): Expr => (hi ? { t: 'range', lo, hi, primes: false, span: join(lo.span, (hi as Expr).span) } : lo));
        },
      },
    ]);
  });

  private additive = this.RULE('additive', (): Expr => {
    const first = this.SUBRULE(this.multiplicative);
    const rest: { op: ArithOp; rhs: Expr; span: SourceSpan }[] = [];
    this.MANY(() => {
      const opTok = this.OR([{ ALT: () => this.CONSUME(T.Plus) }, { ALT: () => this.CONSUME(T.Minus) }]);
      const rhs = this.SUBRULE2(this.multiplicative);
      this.ACTION(() => rest.push({ op: ARITH[opTok.tokenType.name]!, rhs, span: spanOf(opTok) }));
    });
    return this.ACTION(() => (rest.length === 0 ? first : { t: 'arith', first, rest, span: join(first.span, rest[rest.length - 1]!.rhs.span) }));
  });

  public multiplicative = this.RULE('multiplicative', (): Expr => {
    const first = this.SUBRULE(this.unary);
    const rest: { op: ArithOp; rhs: Expr; span: SourceSpan }[] = [];
    this.MANY(() => {
      const opTok = this.OR([
        { ALT: () => this.CONSUME(T.Times) },
        { ALT: () => this.CONSUME(T.Slash) },
        { ALT: () => this.CONSUME(T.Mod) },
        { ALT: () => this.CONSUME(T.Div) },
      ]);
      const rhs = this.SUBRULE2(this.unary);
      this.ACTION(() => rest.push({ op: ARITH[opTok.tokenType.name]!, rhs, span: spanOf(opTok) }));
    });
    return this.ACTION(() => (rest.length === 0 ? first : { t: 'arith', first, rest, span: join(first.span, rest[rest.length - 1]!.rhs.span) }));
  });

  private unary = this.RULE('unary', (): Expr => {
    return this.OR([
      {
        ALT: () => {
          const start = this.CONSUME(T.Minus);
          const arg = this.SUBRULE(this.unary);
          return this.ACTION((): Expr => ({ t: 'neg', arg, span: join(spanOf(start), arg.span) }));
        },
      },
      { ALT: () => this.SUBRULE(this.power) },
    ]);
  });

  private power = this.RULE('power', (): Expr => {
    const base = this.SUBRULE(this.postfix);
    let exp: Expr | null = null;
    this.OPTION(() => {
      this.CONSUME(T.Caret);
      exp = this.SUBRULE(this.unary);
    });
    return this.ACTION((): Expr => (exp ? { t: 'pow', base, exp, span: join(base.span, (exp as Expr).span) } : base));
  });

  private postfix = this.RULE('postfix', (): Expr => {
    let e = this.SUBRULE(this.primary);
    this.MANY(() => {
      this.OR([
        {
          ALT: () => {
            const open = this.CONSUME(T.LParen);
            const args = this.SUBRULE(this.args);
            this.CONSUME(T.RParen);
            e = this.ACTION((): Expr => {
              if (e.t !== 'name') throw new DrawShapeError('only a named function can be called: write name(arguments)', spanOf(open));
              return { t: 'call', name: e.name, args, span: spanOf2(e.span, this.end()), nameSpan: e.span };
            });
          },
        },
        {
          ALT: () => {
            this.CONSUME(T.LBracket);
            const index = this.SUBRULE(this.expression);
            this.CONSUME(T.RBracket);
            e = this.ACTION((): Expr => ({ t: 'index', target: e, index, span: spanOf2(e.span, this.end()) }));
          },
        },
        {
          ALT: () => {
            this.CONSUME(T.Dot);
            const name = this.CONSUME(T.Name);
            e = this.ACTION((): Expr => ({ t: 'field', target: e, name: name.image, span: spanOf2(e.span, name) }));
          },
        },
        {
          ALT: () => {
            const tok = this.CONSUME(T.Hash);
            e = this.ACTION((): Expr => ({ t: 'postfix', op: '#', arg: e, span: spanOf2(e.span, tok) }));
          },
        },
        {
          ALT: () => {
            const tok = this.CONSUME(T.Bang);
            e = this.ACTION((): Expr => ({ t: 'postfix', op: '!', arg: e, span: spanOf2(e.span, tok) }));
          },
        },
      ]);
    });
    return e;
  });

  private args = this.RULE('args', (): Expr[] => {
    const out: Expr[] = [];
    this.MANY_SEP({ SEP: T.Comma, DEF: () => out.push(this.SUBRULE(this.expression)) });
    return out;
  });

  private primary = this.RULE('primary', (): Expr => {
    return this.OR([
      {
        ALT: () => {
          const tok = this.CONSUME(T.NumberLit);
          return this.ACTION((): Expr => {
            const v = numberValue(tok.image);
            return typeof v === 'bigint' ? { t: 'int', value: v, span: spanOf(tok) } : { t: 'rat', value: v, span: spanOf(tok) };
          });
        },
      },
      {
        ALT: () => {
          const tok = this.CONSUME(T.StringLit);
          return this.ACTION((): Expr => ({ t: 'str', value: unquote(tok.image), span: spanOf(tok) }));
        },
      },
      { ALT: () => { const tok = this.CONSUME(T.True); return { t: 'bool', value: true, span: this.ACTION(() => spanOf(tok)) } as Expr; } },
      { ALT: () => { const tok = this.CONSUME(T.False); return { t: 'bool', value: false, span: this.ACTION(() => spanOf(tok)) } as Expr; } },
      {
        ALT: () => {
          const tok = this.CONSUME(T.Identifier);
          return this.ACTION((): Expr => ({ t: 'name', name: tok.image, span: spanOf(tok) }));
        },
      },
      { GATE: () => tokenMatcher(this.LA(2), T.Name) && this.LA(3).tokenType === T.Colon, ALT: () => this.SUBRULE(this.recordLit) },
      {
        ALT: () => {
          this.CONSUME(T.LParen);
          const e = this.SUBRULE(this.expression);
          this.CONSUME(T.RParen);
          return e;
        },
      },
      { ALT: () => this.SUBRULE(this.tupleLit) },
      { ALT: () => this.SUBRULE(this.seriesLit) },
      { ALT: () => this.SUBRULE(this.bigOperator) },
    ]);
  });

  private recordLit = this.RULE('recordLit', (): Expr => {
    const start = this.CONSUME(T.LParen);
    const fields: { name: string; value: Expr; span: SourceSpan }[] = [];
    this.AT_LEAST_ONE_SEP({
      SEP: T.Comma,
      DEF: () => {
        const name = this.CONSUME(T.Name);
        this.CONSUME(T.Colon);
        const value = this.SUBRULE(this.expression);
        this.ACTION(() => fields.push({ name: name.image, value, span: spanOf(name) }));
      },
    });
    this.CONSUME(T.RParen);
    return this.ACTION((): Expr => ({ t: 'record', fields, span: spanOf(start, this.end()) }));
  });

  private tupleLit = this.RULE('tupleLit', (): Expr => this.collection(T.LBrace, T.RBrace, 'tuple'));
  private seriesLit = this.RULE('seriesLit', (): Expr => this.collection(T.LBracket, T.RBracket, 'series'));

  private collection(open: TokenType, close: TokenType, into: 'tuple' | 'series'): Expr {
    const start = this.CONSUME(open);
    const items: Expr[] = [];
    let binders: Binder[] | null = null;
    this.OPTION(() => {
      items.push(this.SUBRULE(this.expression));
      this.OR([
        {
          ALT: () => {
            this.CONSUME(T.Colon);
            binders = this.SUBRULE(this.binders);
          },
        },
        {
          ALT: () => {
            this.MANY(() => {
              this.CONSUME(T.Comma);
              items.push(this.SUBRULE2(this.expression));
            });
          },
        },
      ]);
    });
    this.CONSUME(close);
    return this.ACTION((): Expr => {
      const span = spanOf(start, this.end());
      const kind = into;
      if (binders) return { t: 'builder', into: kind, head: items[0]!, binders, span };
      return kind === 'tuple' ? { t: 'tuple', items, span } : { t: 'series', items, span };
    });
  }

  private bigOperator = this.RULE('bigOperator', (): Expr => {
    const opTok = this.OR([
      { ALT: () => this.CONSUME(T.Sum) },
      { ALT: () => this.CONSUME(T.Prod) },
      { ALT: () => this.CONSUME(T.All) },
      { ALT: () => this.CONSUME(T.Any) },
      { ALT: () => this.CONSUME(T.Hash) },
      { ALT: () => this.CONSUME(T.TableOp) },
    ]);
    return this.OR2([
      {
        ALT: () => {
          this.CONSUME(T.LBracket);
          const binders = this.SUBRULE(this.binders);
          this.CONSUME(T.RBracket);
          const op = this.ACTION(() => BIG[opTok.tokenType.name]!);
          // ∑ and ∏ extend over a product (as in ∑ 1/n); quantifiers and counts over a comparison.
          const body = this.OR3({ IGNORE_AMBIGUITIES: true, DEF: [
            { GATE: () => op === 'sum' || op === 'prod', ALT: () => this.SUBRULE(this.multiplicative) },
            { GATE: () => op === 'table', ALT: () => this.SUBRULE(this.primary) },
            { ALT: () => this.SUBRULE(this.notExpr) },
          ] });
          return this.ACTION((): Expr => ({ t: 'big', op, binders, body, span: spanOf2(spanOf(opTok), this.end()) }));
        },
      },
      {
        // sum(s), prod(s), all(s), any(s), table(rows): the same words as plain functions.
        GATE: () => opTok.tokenType !== T.Hash,
        ALT: () => {
          this.CONSUME(T.LParen);
          const args = this.SUBRULE(this.args);
          this.CONSUME(T.RParen);
          return this.ACTION((): Expr => ({ t: 'call', name: BIG[opTok.tokenType.name]!, args, span: spanOf2(spanOf(opTok), this.end()), nameSpan: spanOf(opTok) }));
        },
      },
    ]);
  });
}

function spanOf2(a: SourceSpan, b: IToken): SourceSpan {
  const end = (b.endOffset ?? b.startOffset) + 1;
  return { ...a, length: Math.max(a.length, end - a.offset) };
}

/** A shape error found while building the tree (reported like a syntax error). */
export class DrawShapeError extends Error {
  constructor(
    message: string,
    readonly span: SourceSpan,
  ) {
    super(message);
  }
}

export function unquote(image: string): string {
  return image.slice(1, -1).replace(/\\(.)/g, (_, c: string) => (c === 'n' ? '\n' : c === 't' ? '\t' : c));
}

let instance: SiftParser | null = null;

/** The shared parser instance (grammar analysis runs once per process). */
export function siftParser(): SiftParser {
  return (instance ??= new SiftParser());
}

export type { SiftParser };
