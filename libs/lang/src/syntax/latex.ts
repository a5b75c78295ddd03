import type { ArithOp, Binder, CompareOp, Expr, Stmt } from './ast';
import { parse } from './parse';

/**
 * A LaTeX printer for Sift syntax trees: the mathematics a claim states, as a paper would set it.
 * `∏[q ∈ primes 5..p](q − 2)` becomes `\prod_{\substack{5 \le q \le p\\ q \text{ prime}}} (q - 2)`.
 * The output needs amsmath (\operatorname, \text, \substack, cases) and nothing else. The tree
 * drops parentheses, so they are put back from the grammar's precedence levels.
 */

const GREEK: Record<string, string> = {
  α: '\\alpha', β: '\\beta', γ: '\\gamma', δ: '\\delta', ε: '\\varepsilon', ζ: '\\zeta', η: '\\eta', θ: '\\theta',
  ι: '\\iota', κ: '\\kappa', λ: '\\lambda', μ: '\\mu', ν: '\\nu', ξ: '\\xi', ο: 'o', π: '\\pi', ρ: '\\rho',
  ς: '\\varsigma', σ: '\\sigma', τ: '\\tau', υ: '\\upsilon', φ: '\\varphi', χ: '\\chi', ψ: '\\psi', ω: '\\omega',
  Α: 'A', Β: 'B', Γ: '\\Gamma', Δ: '\\Delta', Ε: 'E', Ζ: 'Z', Η: 'H', Θ: '\\Theta', Ι: 'I', Κ: 'K', Λ: '\\Lambda',
  Μ: 'M', Ν: 'N', Ξ: '\\Xi', Ο: 'O', Π: '\\Pi', Ρ: 'P', Σ: '\\Sigma', Τ: 'T', Υ: '\\Upsilon', Φ: '\\Phi',
  Χ: 'X', Ψ: '\\Psi', Ω: '\\Omega',
};

/** Greek letters Sift accepts in names (U+0391–U+03A9, U+03B1–U+03C9) with their LaTeX maths command. */
export const GREEK_LATEX: Readonly<Record<string, string>> = GREEK;

const COMPARE: Record<CompareOp, string> = { '=': '=', '≠': '\\neq', '<': '<', '≤': '\\le', '>': '>', '≥': '\\ge', '≈': '\\approx', '∈': '\\in' };
const ARITH: Record<ArithOp, string> = { '+': '+', '-': '-', '*': '\\cdot', '/': '/', mod: '\\bmod', div: '\\mathbin{\\mathrm{div}}' };

/** Text for \text{…} and \operatorname{…}: the characters that are special in LaTeX escaped. */
function textEscape(s: string): string {
  return s.replace(/[\\{}$&#^_%~]/g, (c) =>
    c === '\\' ? '\\textbackslash{}' : c === '^' ? '\\textasciicircum{}' : c === '~' ? '\\textasciitilde{}' : `\\${c}`,
  );
}

/** A Sift name in maths: one letter italic, Greek as its command, longer names upright-italic words. */
export function nameToLatex(name: string): string {
  const primes = /'+$/.exec(name)?.[0] ?? '';
  const base = primes ? name.slice(0, -primes.length) : name;
  const chars = [...base];
  let out: string;
  if (chars.length === 1) out = GREEK[base] ?? base.replace('_', '\\_');
  else if (chars.every((c) => GREEK[c])) out = chars.map((c) => GREEK[c]).join(' ');
  else {
    // A trailing digit run reads as a subscript (x1 → x_{1}); anything else is one italic word.
    const sub = /^([A-Za-z\u0391-\u03c9])(\d+)$/.exec(base);
    out = sub ? `${GREEK[sub[1]!] ?? sub[1]}_{${sub[2]}}` : `\\mathit{${chars.map((c) => (GREEK[c] ? `${GREEK[c]} ` : c === '_' ? '\\_' : c)).join('')}}`;
  }
  return out + primes;
}

function intToLatex(v: bigint): string {
  const s = (v < 0n ? -v : v).toString();
  // Digits grouped by thin spaces from five digits on, as in print.
  const grouped = s.length > 4 ? s.replace(/\B(?=(\d{3})+(?!\d))/g, '\\,') : s;
  return v < 0n ? `-${grouped}` : grouped;
}

/** Precedence of a node as an operand (higher binds tighter); mirrors parser.ts. */
function prec(e: Expr): number {
  switch (e.t) {
    case 'if': return 0;
    case 'logic': return e.op === 'or' ? 1 : 2;
    case 'not': return 3;
    case 'compare': return 4;
    case 'range': return 5;
    case 'arith': return e.rest[0]!.op === '+' || e.rest[0]!.op === '-' ? 6 : 7;
    case 'big': return e.op === 'sum' || e.op === 'prod' ? 7 : 3;
    case 'neg': return 8;
    case 'pow': return 9;
    case 'int': return e.value < 0n ? 8 : 11;
    default: return 10;
  }
}

const paren = (s: string): string => `\\left(${s}\\right)`;

export interface LatexOptions {
  /** The source the tree was parsed from: decimal literals are printed as written. */
  source?: string;
}

class Printer {
  constructor(private readonly opts: LatexOptions) {}

  at(e: Expr, min: number): string {
    const s = this.expr(e);
    return prec(e) < min ? paren(s) : s;
  }

  expr(e: Expr): string {
    switch (e.t) {
      case 'int': return intToLatex(e.value);
      case 'rat': {
        const src = this.opts.source?.slice(e.span.offset, e.span.offset + e.span.length);
        if (src && /^[\d_.eE+]+$/.test(src)) return src.replace(/_/g, '');
        return `\\tfrac{${e.value.n}}{${e.value.d}}`;
      }
      case 'str': return `\\text{\`\`${textEscape(e.value)}''}`;
      case 'bool': return `\\mathrm{${e.value}}`;
      case 'name': return nameToLatex(e.name);
      case 'tuple': return `\\{${e.items.map((x) => this.expr(x)).join(', ')}\\}`;
      case 'series': return `[${e.items.map((x) => this.expr(x)).join(', ')}]`;
      case 'builder': {
        const [open, close] = e.into === 'tuple' ? ['\\{', '\\}'] : ['[', ']'];
        return `${open}\\, ${this.expr(e.head)} : ${this.binders(e.binders, ', ')} \\,${close}`;
      }
      case 'record': return `\\left(${e.fields.map((f) => `\\text{${textEscape(f.name)}}\\colon ${this.expr(f.value)}`).join(',\\ ')}\\right)`;
      case 'big': return this.big(e);
      case 'call': return this.call(e.name, e.args);
      case 'index': return `${this.at(e.target, 10)}[${this.expr(e.index)}]`;
      case 'field': return `${this.at(e.target, 10)}.\\mathrm{${textEscape(e.name)}}`;
      case 'postfix': return `${this.at(e.arg, 10)}${e.op === '#' ? '\\#' : '!'}`;
      case 'neg': return `-${this.at(e.arg, 8)}`;
      case 'not': return `\\neg ${this.at(e.arg, 3)}`;
      case 'arith': return this.arith(e);
      case 'pow': return `{${this.at(e.base, 10)}}^{${this.expr(e.exp)}}`;
      case 'compare': return [this.at(e.first, 5), ...e.rest.map((r) => `${COMPARE[r.op]} ${this.at(r.rhs, 5)}`)].join(' ');
      case 'logic': return e.items.map((x) => this.at(x, e.op === 'or' ? 2 : 3)).join(e.op === 'or' ? ' \\vee ' : ' \\wedge ');
      case 'range': return this.range(e.lo, e.hi, e.primes);
      case 'if': return `\\begin{cases} ${this.expr(e.then)} & \\text{if } ${this.expr(e.cond)} \\\\ ${this.expr(e.otherwise)} & \\text{otherwise} \\end{cases}`;
    }
  }

  private arith(e: Extract<Expr, { t: 'arith' }>): string {
    const level = prec(e);
    const items = [e.first, ...e.rest.map((r) => r.rhs)];
    return items
      .map((x, i) => {
        // A ∑/∏ extends over the product after it, so one that is not the last factor needs parentheses;
        // right operands of − and / need them at the same level (a − (b + c)).
        const op = i > 0 ? e.rest[i - 1]!.op : null;
        const tighter = op === '-' || op === '/' || op === 'mod' || op === 'div';
        const bigInside = x.t === 'big' && i < items.length - 1;
        const s = this.expr(x);
        const wrapped = prec(x) < level || (tighter && prec(x) === level && x.t === 'arith') || bigInside ? paren(s) : s;
        return i === 0 ? wrapped : `${ARITH[op!]} ${wrapped}`;
      })
      .join(' ');
  }

  private call(name: string, args: Expr[]): string {
    const list = args.map((a) => this.expr(a)).join(', ');
    if (name === 'abs' && args.length === 1) return `\\left\\lvert ${list} \\right\\rvert`;
    if (name === 'floor' && args.length === 1) return `\\left\\lfloor ${list} \\right\\rfloor`;
    if (name === 'ceil' && args.length === 1) return `\\left\\lceil ${list} \\right\\rceil`;
    // A one-letter name (φ) reads as the letter; a word as an operator name, its Greek letters as commands.
    const head = [...name].length === 1 ? nameToLatex(name) : `\\operatorname{${[...textEscape(name)].map((c) => (GREEK[c] ? `${GREEK[c]} ` : c)).join('')}}`;
    return `${head}\\left(${list}\\right)`;
  }

  private range(lo: Expr, hi: Expr, primes: boolean): string {
    const set = `\\{${this.at(lo, 6)}, \\ldots, ${this.at(hi, 6)}\\}`;
    return primes ? `\\{\\text{primes in } [${this.expr(lo)}, ${this.expr(hi)}]\\}` : set;
  }

  /** One binder as a condition: `5 \le p \le 23,\ p \text{ prime}`, `x \in H`, or a filter. */
  binder(b: Binder): string {
    if (b.t === 'filter') return this.expr(b.cond);
    const v = nameToLatex(b.name);
    const d = b.domain;
    if (d.t === 'range') {
      const between = `${this.at(d.lo, 6)} \\le ${v} \\le ${this.at(d.hi, 6)}`;
      return d.primes ? `${between},\\ ${v} \\text{ prime}` : between;
    }
    return `${v} \\in ${this.at(d, 5)}`;
  }

  binders(bs: Binder[], sep: string): string {
    return bs.map((b) => this.binder(b)).join(sep);
  }

  private big(e: Extract<Expr, { t: 'big' }>): string {
    const body = e.body;
    if (e.op === 'sum' || e.op === 'prod') {
      const cmd = e.op === 'sum' ? '\\sum' : '\\prod';
      const only = e.binders.length === 1 ? e.binders[0]! : null;
      let limits: string;
      if (only?.t === 'bind' && only.domain.t === 'range' && !only.domain.primes) {
        limits = `_{${nameToLatex(only.name)} = ${this.expr(only.domain.lo)}}^{${this.expr(only.domain.hi)}}`;
      } else {
        const lines = e.binders.flatMap((b) =>
          b.t === 'bind' && b.domain.t === 'range' && b.domain.primes
            ? [`${this.at(b.domain.lo, 6)} \\le ${nameToLatex(b.name)} \\le ${this.at(b.domain.hi, 6)}`, `${nameToLatex(b.name)} \\text{ prime}`]
            : [this.binder(b)],
        );
        limits = `_{\\substack{${lines.join(' \\\\ ')}}}`;
      }
      return `${cmd}${limits} ${this.at(body, 7)}`;
    }
    const conds = this.binders(e.binders, ',\\ ');
    if (e.op === 'all') return `\\forall\\, ${conds}\\colon\\ ${this.at(body, 3)}`;
    if (e.op === 'any') return `\\exists\\, ${conds}\\colon\\ ${this.at(body, 3)}`;
    if (e.op === 'count') return `\\#\\{\\, ${conds} : ${this.expr(body)} \\,\\}`;
    return `\\operatorname{table}_{${conds}} ${this.at(body, 10)}`;
  }
}

/** An expression as LaTeX maths (no surrounding `$`). */
export function exprToLatex(e: Expr, opts: LatexOptions = {}): string {
  return new Printer(opts).expr(e);
}

/** A claim as typeset mathematics: its label, its statement, and the range it is checked over. */
export interface ClaimLatex {
  label: string | null;
  /** The statement as LaTeX maths. */
  statement: string;
  /** The `over` binders as LaTeX maths (`5 \le p \le 23,\ p \text{ prime}`), or null without `over`. */
  over: string | null;
}

/** A statement as LaTeX maths, or null for statements that are not mathematics (`draw`). */
export function statementToLatex(s: Stmt, opts: LatexOptions = {}): string | null {
  const p = new Printer(opts);
  switch (s.t) {
    case 'let': return `${nameToLatex(s.name)}${s.params ? `\\left(${s.params.map(nameToLatex).join(', ')}\\right)` : ''} := ${p.expr(s.value)}`;
    case 'claim': return `${p.expr(s.body)}${s.binders.length ? `\\qquad \\text{for } ${p.binders(s.binders, ',\\ ')}` : ''}`;
    case 'show':
    case 'expr': return p.expr(s.value);
    case 'draw': return null;
  }
}

/**
 * The claims of a cell, each printed from its syntax tree. A source that does not parse gives no
 * claims (the listing beside it still shows the text as written).
 */
export function claimsToLatex(source: string): ClaimLatex[] {
  const { program, errors } = parse(source);
  if (errors.length) return [];
  const p = new Printer({ source });
  return program.statements.flatMap((s) =>
    s.t === 'claim' ? [{ label: s.label, statement: p.expr(s.body), over: s.binders.length ? p.binders(s.binders, ',\\ ') : null }] : [],
  );
}
