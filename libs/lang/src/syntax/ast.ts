import type { SourceSpan } from '../errors';
import type { Rational } from '../values/rational';

/** Expression nodes. Chains of the same precedence are flat lists (no deep left-nested trees). */
export type Expr =
  | { t: 'int'; value: bigint; span: SourceSpan }
  | { t: 'rat'; value: Rational; span: SourceSpan }
  | { t: 'str'; value: string; span: SourceSpan }
  | { t: 'bool'; value: boolean; span: SourceSpan }
  | { t: 'name'; name: string; span: SourceSpan }
  | { t: 'tuple'; items: Expr[]; span: SourceSpan }
  | { t: 'series'; items: Expr[]; span: SourceSpan }
  | { t: 'builder'; into: 'tuple' | 'series'; head: Expr; binders: Binder[]; span: SourceSpan }
  | { t: 'record'; fields: { name: string; value: Expr; span: SourceSpan }[]; span: SourceSpan }
  | { t: 'big'; op: BigOp; binders: Binder[]; body: Expr; span: SourceSpan }
  | { t: 'call'; name: string; args: Expr[]; span: SourceSpan; nameSpan: SourceSpan }
  | { t: 'index'; target: Expr; index: Expr; span: SourceSpan }
  | { t: 'field'; target: Expr; name: string; span: SourceSpan }
  | { t: 'postfix'; op: '#' | '!'; arg: Expr; span: SourceSpan }
  | { t: 'neg'; arg: Expr; span: SourceSpan }
  | { t: 'not'; arg: Expr; span: SourceSpan }
  | { t: 'arith'; first: Expr; rest: { op: ArithOp; rhs: Expr; span: SourceSpan }[]; span: SourceSpan }
  | { t: 'pow'; base: Expr; exp: Expr; span: SourceSpan }
  | { t: 'compare'; first: Expr; rest: { op: CompareOp; rhs: Expr; span: SourceSpan }[]; span: SourceSpan }
  | { t: 'logic'; op: 'and' | 'or'; items: Expr[]; span: SourceSpan }
  | { t: 'range'; lo: Expr; hi: Expr; primes: boolean; span: SourceSpan }
  | { t: 'if'; cond: Expr; then: Expr; otherwise: Expr; span: SourceSpan };

export type BigOp = 'sum' | 'prod' | 'all' | 'any' | 'count' | 'table';
export type ArithOp = '+' | '-' | '*' | '/' | 'mod' | 'div';
export type CompareOp = '=' | '≠' | '<' | '≤' | '>' | '≥' | '≈' | '∈';

/** One item of a binder list: `x ∈ domain` binds, anything else filters. */
export type Binder =
  | { t: 'bind'; name: string; domain: Expr; span: SourceSpan }
  | { t: 'filter'; cond: Expr; span: SourceSpan };

export type ChartKind = 'line' | 'scatter' | 'bar';

export type Stmt =
  | { t: 'let'; name: string; params: string[] | null; value: Expr; span: SourceSpan }
  | { t: 'claim'; label: string | null; body: Expr; binders: Binder[]; text: string; span: SourceSpan }
  | { t: 'show'; value: Expr; label: string | null; digits: number | null; span: SourceSpan }
  | {
      t: 'draw';
      kind: ChartKind;
      source: Expr;
      x: string;
      ys: string[];
      logX: boolean;
      logY: boolean;
      title: string | null;
      span: SourceSpan;
    }
  | { t: 'expr'; value: Expr; span: SourceSpan };

export interface Program {
  statements: Stmt[];
}
