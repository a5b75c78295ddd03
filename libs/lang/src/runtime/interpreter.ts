import { EngineError } from '@cribra/engine';
import { builtin, type CallContext } from '../builtins/registry';
import { didYouMean } from './suggest';
import { domainError, limitError, SiftError, type SourceSpan, typeError } from '../errors';
import type { ChartOutput, SiftOutput, VerdictOutput, Binding } from '../outputs/types';
import type { DataAccess } from '../provider/types';
import type { Binder, Expr, Program, Stmt } from '../syntax/ast';
import { formatReal, formatValue } from '../values/format';
import { bitLength, Rational } from '../values/rational';
import { valueToJson } from '../values/to-json';
import { valueJsonText } from '../outputs/value-text';
import { IntRange, SiftRecord, Table, Tuple, typeName, UserFn, type Value } from '../values/types';
import * as A from './arithmetic';
import type { Limits } from './limits';
import { forEachPrime, isPrime, primeCountBound } from './primes';

export interface InterpreterOptions {
  limits: Limits;
  data: DataAccess | null;
  onProgress?: (fraction: number, message: string) => void;
  /** Polled with the clock; answering true stops the run with a 'cancelled' error. */
  shouldStop?: () => boolean;
  /** Milliseconds clock (injectable for tests). */
  now?: () => number;
}

class Scope {
  constructor(
    readonly parent: Scope | null,
    readonly vars = new Map<string, Value>(),
  ) {}
  lookup(name: string): Value | undefined {
    for (let s: Scope | null = this; s; s = s.parent) {
      const v = s.vars.get(name);
      if (v !== undefined) return v;
    }
    return undefined;
  }
  /** Every name visible here (for "did you mean"). */
  names(): string[] {
    const out: string[] = [];
    for (let s: Scope | null = this; s; s = s.parent) out.push(...s.vars.keys());
    return out;
  }
}

const CHECK_EVERY = 2048;
/** Longest silence between two progress reports of a creeping builtin (the fraction may not have moved a percent). */
const PROGRESS_EVERY_MS = 250;

/** A tree-walking interpreter over one cell. Deterministic: no clock or randomness reaches a value. */
export class Interpreter {
  readonly outputs: SiftOutput[] = [];
  steps = 0;
  private readonly started: number;
  private readonly now: () => number;
  private nextCheck = CHECK_EVERY;
  private callDepth = 0;
  private loopDepth = 0;
  private progressAt = -1;
  private progressTime = 0;

  constructor(private readonly opts: InterpreterOptions) {
    this.now = opts.now ?? (() => Date.now());
    this.started = this.now();
  }

  /** Runs every statement in order; throws a SiftError at the first failure (outputs so far are kept). */
  run(program: Program): SiftOutput[] {
    const scope = new Scope(null);
    const total = program.statements.length;
    program.statements.forEach((stmt, i) => {
      this.statement(stmt, scope);
      this.report((i + 1) / total, `statement ${i + 1} of ${total}`);
    });
    return this.outputs;
  }

  // ---------------------------------------------------------------- budget

  tick(span: SourceSpan, n = 1): void {
    this.steps += n;
    // Big ticks come from builtins between blocks of engine work: look at the clock each time.
    if (this.steps >= this.nextCheck || n >= 1000) this.checkpoint(span);
  }

  /** Checks the step and time limits and cancellation now (engine hooks call it between chunks of work). */
  private checkpoint(span: SourceSpan): void {
    this.nextCheck = this.steps + CHECK_EVERY;
    const { maxSteps, maxMillis } = this.opts.limits;
    if (this.steps > maxSteps) throw limitError(`the step limit (${maxSteps} steps) was reached`, span);
    if (this.now() - this.started > maxMillis) throw limitError(`the time limit (${maxMillis / 1000} s) was reached`, span);
    if (this.opts.shouldStop?.()) throw new SiftError('cancelled', 'the run was cancelled', span);
  }

  private report(fraction: number, message: string): void {
    if (!this.opts.onProgress) return;
    const pct = Math.floor(fraction * 100);
    // One report per percent, and at least every PROGRESS_EVERY_MS while a huge range creeps through one percent.
    const t = this.now();
    if (pct === this.progressAt && fraction < 1 && t - this.progressTime < PROGRESS_EVERY_MS) return;
    this.progressAt = pct;
    this.progressTime = t;
    this.opts.onProgress(Math.min(1, Math.max(0, fraction)), message);
  }

  private emit(out: SiftOutput, span: SourceSpan): void {
    if (this.outputs.length >= this.opts.limits.maxOutputs) throw limitError(`a cell may produce at most ${this.opts.limits.maxOutputs} outputs`, span);
    this.outputs.push(out);
  }

  // ---------------------------------------------------------------- statements

  private statement(stmt: Stmt, scope: Scope): void {
    switch (stmt.t) {
      case 'let': {
        this.checkBindable(stmt.name, stmt.span);
        if (scope.vars.has(stmt.name)) throw typeError(`'${stmt.name}' is already defined in this cell`, stmt.span);
        if (stmt.params) {
          const seen = new Set<string>();
          for (const p of stmt.params) {
            this.checkBindable(p, stmt.span);
            if (seen.has(p)) throw typeError(`parameter '${p}' appears twice`, stmt.span);
            seen.add(p);
          }
          // The function sees a snapshot of the names defined so far, never itself: no recursion.
          scope.vars.set(stmt.name, new UserFn(stmt.name, stmt.params, stmt.value, new Scope(scope.parent, new Map(scope.vars))));
        } else {
          scope.vars.set(stmt.name, this.expr(stmt.value, scope));
        }
        return;
      }
      case 'expr':
      case 'show':
        this.show(this.expr(stmt.value, scope), stmt.t === 'show' ? stmt.label : null, stmt.t === 'show' ? stmt.digits : null, stmt.span);
        return;
      case 'claim':
        this.emit(this.claim(stmt, scope), stmt.span);
        return;
      case 'draw':
        this.emit(this.draw(stmt, scope), stmt.span);
        return;
    }
  }

  private checkBindable(name: string, span: SourceSpan): void {
    const b = builtin(name);
    if (b && !b.yieldsToCellNames) throw typeError(`'${name}' is the name of a builtin; choose another name`, span);
  }

  private show(v: Value, label: string | null, digits: number | null, span: SourceSpan): void {
    if (digits !== null && (!Number.isInteger(digits) || digits < 1 || digits > 1000)) throw domainError('digits must be between 1 and 1000', span);
    if (typeof v === 'string' && label === null) return this.emit({ kind: 'text', text: v }, span);
    if (v instanceof UserFn) throw typeError(`'${v.name}' is a function; call it to show a value`, span);
    if (v instanceof Table) {
      return this.emit({ kind: 'table', label, columns: [...v.columns], rows: v.rows.map((r) => r.map(valueToJson)) }, span);
    }
    let text: string;
    if (v instanceof Rational && digits !== null) text = decimalDigits(v, digits);
    else if (typeof v === 'number') text = formatReal(v, digits !== null ? Math.min(digits, 17) : null);
    else text = formatValue(v, digits !== null ? Math.min(digits, 17) : null);
    this.emit({ kind: 'value', label, value: valueToJson(v), text }, span);
  }

  // ---------------------------------------------------------------- claims

  private claim(stmt: Extract<Stmt, { t: 'claim' }>, scope: Scope): VerdictOutput {
    let checked = 0;
    let skipped = 0;
    let first: Binding | null = null;
    let last: Binding | null = null;
    let counterexample: VerdictOutput['counterexample'] = null;
    const names = stmt.binders.filter((b) => b.t === 'bind').map((b) => (b as { name: string }).name);
    const bindingOf = (s: Scope): Binding => names.map((n) => [n, valueToJson(s.lookup(n)!)] as [string, ReturnType<typeof valueToJson>]);
    const check = (s: Scope): boolean => {
      checked++;
      const r = this.relation(stmt.body, s);
      const binding = bindingOf(s);
      if (!first) first = binding;
      last = binding;
      if (!r.ok) {
        counterexample = { binding, relation: r.op, lhs: valueToJson(r.lhs), rhs: r.rhs === null ? null : valueToJson(r.rhs) };
        return false;
      }
      return true;
    };
    if (stmt.binders.length === 0) check(scope);
    else this.iterate(stmt.binders, scope, stmt.span, check, () => skipped++, true);
    const over = stmt.binders.length ? stmt.text.slice(stmt.binders[0]!.span.offset - stmt.span.offset).trim() : null;
    const holds = counterexample === null;
    const cx = counterexample as VerdictOutput['counterexample'];
    const where = (b: Binding) => b.map(([n, v]) => `${n} = ${jsonText(v)}`).join(', ');
    const summary = holds
      ? over
        ? `holds in all ${checked} cases checked (${over}${skipped ? `; ${skipped} left out by the conditions` : ''}); computed evidence over this range, not a proof`
        : 'holds (checked once)'
      : `fails${cx!.binding.length ? ` at ${where(cx!.binding)}` : ''}: ${cx!.relation ? `${jsonText(cx!.lhs)} ${cx!.relation} ${jsonText(cx!.rhs!)} is false` : 'the condition is false'}`;
    return { kind: 'verdict', label: stmt.label, statement: stmt.text, holds, over, checked, skipped, first, last, counterexample: cx, summary };
  }

  /** Evaluates a claim body; for a comparison it keeps both sides of the first failing link. */
  private relation(body: Expr, scope: Scope): { ok: boolean; op: string | null; lhs: Value; rhs: Value | null } {
    if (body.t === 'compare') {
      let left = this.expr(body.first, scope);
      for (const link of body.rest) {
        const right = this.expr(link.rhs, scope);
        if (!this.compareOne(link.op, left, right, link.span)) return { ok: false, op: link.op, lhs: left, rhs: right };
        left = right;
      }
      return { ok: true, op: null, lhs: true, rhs: null };
    }
    const v = this.expr(body, scope);
    if (typeof v !== 'boolean') throw typeError(`a claim must be a condition (true or false), got ${typeName(v)}`, body.span);
    return { ok: v, op: null, lhs: v, rhs: null };
  }

  // ---------------------------------------------------------------- charts

  private draw(stmt: Extract<Stmt, { t: 'draw' }>, scope: Scope): ChartOutput {
    let src = this.expr(stmt.source, scope);
    if (Array.isArray(src)) src = this.tableFromRows(src, stmt.source.span);
    if (!(src instanceof Table)) throw typeError(`draw needs a table, got ${typeName(src)}`, stmt.source.span);
    const table = src;
    const col = (name: string) => {
      const c = table.column(name);
      if (!c) throw typeError(`the table has no column '${name}' (columns: ${table.columns.join(', ')})`, stmt.span);
      return c;
    };
    const xs = col(stmt.x).map((v) => (A.isNum(v) ? A.toReal(v) : formatValue(v)));
    const series = stmt.ys.map((name) => ({
      name,
      points: col(name).map((v, i) => [xs[i]!, A.isNum(v) && Number.isFinite(A.toReal(v)) ? A.toReal(v) : null] as [number | string, number | null]),
    }));
    return {
      kind: 'chart',
      chart: stmt.kind,
      title: stmt.title,
      x: { label: stmt.x, log: stmt.logX },
      y: { label: stmt.ys.join(', '), log: stmt.logY },
      series,
    };
  }

  // ---------------------------------------------------------------- expressions

  expr(e: Expr, scope: Scope): Value {
    this.tick(e.span);
    switch (e.t) {
      case 'int':
      case 'rat':
      case 'str':
      case 'bool':
        return e.value;
      case 'name': {
        const v = scope.lookup(e.name);
        if (v === undefined) {
          if (builtin(e.name)) throw typeError(`'${e.name}' is a builtin function; call it as ${e.name}(…)`, e.span);
          throw typeError(`unknown name '${e.name}'${didYouMean(e.name, scope.names())}`, e.span);
        }
        if (v instanceof UserFn) throw typeError(`'${e.name}' is a function; call it as ${e.name}(…)`, e.span);
        return v;
      }
      case 'tuple': {
        const items = e.items.map((x) => this.expr(x, scope));
        return this.makeTuple(items, e.span, true);
      }
      case 'series':
        this.checkSize(e.items.length, e.span);
        return e.items.map((x) => this.expr(x, scope));
      case 'builder': {
        this.checkSize(this.estimate(e.binders, scope), e.span);
        const out: Value[] = [];
        this.iterate(e.binders, scope, e.span, (s) => {
          out.push(this.expr(e.head, s));
          if (out.length > this.opts.limits.maxElements) throw this.tooMany(e.span);
          return true;
        });
        return e.into === 'tuple' ? this.makeTuple(out, e.span, false) : out;
      }
      case 'record': {
        const fields = new Map<string, Value>();
        for (const f of e.fields) {
          if (fields.has(f.name)) throw typeError(`field '${f.name}' appears twice`, f.span);
          fields.set(f.name, this.expr(f.value, scope));
        }
        return new SiftRecord(fields);
      }
      case 'big':
        return this.bigOp(e, scope);
      case 'call':
        return this.call(e, scope);
      case 'index':
        return this.index(this.expr(e.target, scope), this.expr(e.index, scope), e.span);
      case 'field':
        return this.field(this.expr(e.target, scope), e.name, e.span);
      case 'postfix': {
        const v = this.expr(e.arg, scope);
        return e.op === '#' ? this.primorial(v, e.span) : this.factorial(v, e.span);
      }
      case 'neg':
        return A.neg(this.expr(e.arg, scope), e.span);
      case 'not': {
        const v = this.expr(e.arg, scope);
        if (typeof v !== 'boolean') throw typeError(`'not' needs true or false, got ${typeName(v)}`, e.span);
        return !v;
      }
      case 'arith': {
        let acc = this.expr(e.first, scope);
        const bits = this.opts.limits.maxBits;
        for (const link of e.rest) {
          const r = this.expr(link.rhs, scope);
          switch (link.op) {
            case '+': acc = A.add(acc, r, link.span); break;
            case '-': acc = A.add(acc, r, link.span, -1n); break;
            case '*': acc = A.mul(acc, r, link.span, bits); break;
            case '/': acc = A.div(acc, r, link.span, bits); break;
            case 'mod': acc = A.mod(acc, r, link.span); break;
            case 'div': acc = A.intDiv(acc, r, link.span); break;
          }
          this.checkInt(acc, link.span);
        }
        return acc;
      }
      case 'pow':
        return A.pow(this.expr(e.base, scope), this.expr(e.exp, scope), e.span, this.opts.limits.maxBits);
      case 'compare': {
        let left = this.expr(e.first, scope);
        let ok = true;
        for (const link of e.rest) {
          const right = this.expr(link.rhs, scope);
          if (ok && !this.compareOne(link.op, left, right, link.span)) ok = false;
          left = right;
        }
        return ok;
      }
      case 'logic': {
        for (const item of e.items) {
          const v = this.expr(item, scope);
          if (typeof v !== 'boolean') throw typeError(`'${e.op}' needs true or false on each side, got ${typeName(v)}`, item.span);
          if (e.op === 'and' && !v) return false;
          if (e.op === 'or' && v) return true;
        }
        return e.op === 'and';
      }
      case 'range': {
        const lo = this.expr(e.lo, scope);
        const hi = this.expr(e.hi, scope);
        if (typeof lo !== 'bigint' || typeof hi !== 'bigint') throw typeError(`a range needs integer ends, got ${typeName(lo)}..${typeName(hi)}`, e.span);
        return new IntRange(lo, hi, e.primes);
      }
      case 'if': {
        const c = this.expr(e.cond, scope);
        if (typeof c !== 'boolean') throw typeError(`'if' needs a condition, got ${typeName(c)}`, e.cond.span);
        return this.expr(c ? e.then : e.otherwise, scope);
      }
    }
  }

  private checkInt(v: Value, span: SourceSpan): void {
    if (typeof v === 'bigint' && (v > 1n << 4096n || v < -(1n << 4096n))) A.checkBits(bitLength(v), this.opts.limits.maxBits, 'the result', span);
  }

  private tooMany(span: SourceSpan): SiftError {
    return limitError(`a series, tuple or table may hold at most ${this.opts.limits.maxElements} elements`, span);
  }

  private checkSize(n: number, span: SourceSpan): void {
    if (n > this.opts.limits.maxElements) {
      throw limitError(`this would build about ${n > 1e15 ? n.toExponential(1) : Math.round(n)} elements; a series, tuple or table may hold at most ${this.opts.limits.maxElements}`, span);
    }
  }

  private makeTuple(items: Value[], span: SourceSpan, strict: boolean): Tuple {
    const ints: bigint[] = [];
    for (const v of items) {
      if (typeof v !== 'bigint') throw typeError(`a tuple holds integers, got ${typeName(v)}`, span);
      ints.push(v);
    }
    ints.sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
    const out: bigint[] = [];
    for (const x of ints) {
      if (out.length && out[out.length - 1] === x) {
        if (strict) throw domainError(`the tuple lists ${x} twice; offsets must be distinct`, span);
        continue;
      }
      out.push(x);
    }
    return new Tuple(out);
  }

  private compareOne(op: string, a: Value, b: Value, span: SourceSpan): boolean {
    switch (op) {
      case '=': return A.valuesEqual(a, b);
      case '≠': return !A.valuesEqual(a, b);
      case '≈': return A.approxEqual(a, b, span);
      case '∈': return this.member(a, b, span);
      case '<': return A.compareNum(a, b, op, span) < 0;
      case '≤': return A.compareNum(a, b, op, span) <= 0;
      case '>': return A.compareNum(a, b, op, span) > 0;
      default: return A.compareNum(a, b, op, span) >= 0;
    }
  }

  private member(x: Value, s: Value, span: SourceSpan): boolean {
    if (s instanceof IntRange) {
      if (typeof x !== 'bigint') return false;
      return x >= s.lo && x <= s.hi && (!s.primesOnly || isPrime(x));
    }
    if (s instanceof Tuple) return typeof x === 'bigint' && s.offsets.includes(x);
    if (Array.isArray(s)) {
      this.tick(span, s.length);
      return s.some((y) => A.valuesEqual(x, y));
    }
    if (s instanceof SiftRecord && typeof x === 'string') return s.fields.has(x);
    throw typeError(`'∈' needs a range, tuple or series on its right, got ${typeName(s)}`, span);
  }

  private index(target: Value, i: Value, span: SourceSpan): Value {
    if (target instanceof SiftRecord) {
      if (typeof i !== 'string') throw typeError(`a record is indexed by a field name, got ${typeName(i)}`, span);
      return this.field(target, i, span);
    }
    if (typeof i !== 'bigint') throw typeError(`an index must be an integer (positions count from 1), got ${typeName(i)}`, span);
    const list: readonly Value[] | null = Array.isArray(target) ? target : target instanceof Tuple ? target.offsets : null;
    if (list) {
      if (i < 1n || i > BigInt(list.length)) throw domainError(`index ${i} is outside 1..${list.length}`, span);
      return list[Number(i) - 1]!;
    }
    if (target instanceof Table) {
      if (i < 1n || i > BigInt(target.rows.length)) throw domainError(`row ${i} is outside 1..${target.rows.length}`, span);
      const row = target.rows[Number(i) - 1]!;
      return new SiftRecord(new Map(target.columns.map((c, k) => [c, row[k]!])));
    }
    throw typeError(`a ${typeName(target)} cannot be indexed`, span);
  }

  private field(target: Value, name: string, span: SourceSpan): Value {
    if (target instanceof SiftRecord) {
      const v = target.get(name);
      if (v === undefined) throw typeError(`the record has no field '${name}' (fields: ${[...target.fields.keys()].join(', ')})`, span);
      return v;
    }
    if (target instanceof Table) {
      const c = target.column(name);
      if (!c) throw typeError(`the table has no column '${name}' (columns: ${target.columns.join(', ')})`, span);
      return c;
    }
    if (target instanceof IntRange && (name === 'lo' || name === 'hi')) return name === 'lo' ? target.lo : target.hi;
    throw typeError(`a ${typeName(target)} has no field '${name}'`, span);
  }

  private primorial(v: Value, span: SourceSpan): bigint {
    if (typeof v !== 'bigint' || v < 0n) throw typeError(`n# needs a non-negative integer, got ${formatValue(v)}`, span);
    A.checkBits(Number(v > 10n ** 9n ? 10n ** 9n : v) * 1.45, this.opts.limits.maxBits, `${v}#`, span);
    let acc = 1n;
    forEachPrime(2n, v, span, (p) => {
      this.tick(span);
      acc *= p;
    });
    return acc;
  }

  private factorial(v: Value, span: SourceSpan): bigint {
    if (typeof v !== 'bigint' || v < 0n) throw typeError(`n! needs a non-negative integer, got ${formatValue(v)}`, span);
    const n = Number(v > 10n ** 9n ? 10n ** 9n : v);
    A.checkBits(n > 1 ? n * Math.log2(n) - n * 1.4427 + 1 : 1, this.opts.limits.maxBits, `${v}!`, span);
    let acc = 1n;
    for (let k = 2n; k <= v; k++) {
      this.tick(span);
      acc *= k;
    }
    return acc;
  }

  // ---------------------------------------------------------------- binders and big operators

  /** Upper estimate of the number of assignments of a binder list (filters ignored). */
  private estimate(binders: Binder[], scope: Scope): number {
    let n = 1;
    for (const b of binders) {
      if (b.t !== 'bind') continue;
      // Only closed domains (literal ranges) can be sized before the loop; others are checked as they grow.
      if (b.domain.t === 'range' && b.domain.lo.t === 'int' && b.domain.hi.t === 'int') {
        const lo = b.domain.lo.value;
        const hi = b.domain.hi.value;
        n *= b.domain.primes ? primeCountBound(lo, hi) : Number(hi >= lo ? hi - lo + 1n : 0n);
      } else if (b.domain.t === 'range') {
        const d = this.expr(b.domain, scope);
        if (d instanceof IntRange && !d.primesOnly) n *= Number(d.span);
        else if (d instanceof IntRange) n *= primeCountBound(d.lo, d.hi);
      }
    }
    return n;
  }

  /**
   * Runs `body` for every assignment of the binders, in order (the first binder varies slowest).
   * Filters skip assignments. Stops when body returns false.
   */
  private iterate(binders: Binder[], scope: Scope, span: SourceSpan, body: (s: Scope) => boolean, onSkip?: () => void, reportProgress = true): boolean {
    const step = (k: number, s: Scope): boolean => {
      if (k === binders.length) return body(s);
      const b = binders[k]!;
      if (b.t === 'filter') {
        const c = this.expr(b.cond, s);
        if (typeof c !== 'boolean') throw typeError(`a condition must be true or false, got ${typeName(c)}`, b.span);
        if (!c) {
          onSkip?.();
          return true;
        }
        return step(k + 1, s);
      }
      this.checkBindable(b.name, b.span);
      const domain = this.expr(b.domain, s);
      const inner = new Scope(s);
      const progress = reportProgress && k === 0 && this.loopDepth === 0;
      this.loopDepth++;
      try {
        return this.forEachIn(domain, b.domain.span, (v, frac) => {
          this.tick(b.span);
          inner.vars.set(b.name, v);
          if (progress && frac !== null) this.report(frac, `${b.name} = ${formatValue(v)}`);
          return step(k + 1, inner);
        });
      } finally {
        this.loopDepth--;
      }
    };
    return step(0, scope);
  }

  /** Iterates a domain value; `visit` gets the element and the fraction done (when known). */
  private forEachIn(domain: Value, span: SourceSpan, visit: (v: Value, frac: number | null) => boolean): boolean {
    if (domain instanceof IntRange) {
      const total = domain.span;
      if (domain.primesOnly) {
        let go = true;
        forEachPrime(domain.lo, domain.hi, span, (p) => {
          go = visit(p, total > 0n ? Number(p - domain.lo) / Number(total) : null);
          return go;
        });
        return go;
      }
      for (let x = domain.lo; x <= domain.hi; x++) {
        if (!visit(x, Number(x - domain.lo) / Number(total))) return false;
      }
      return true;
    }
    const list: readonly Value[] | null = Array.isArray(domain) ? domain : domain instanceof Tuple ? domain.offsets : null;
    if (list) {
      for (let i = 0; i < list.length; i++) if (!visit(list[i]!, i / list.length)) return false;
      return true;
    }
    if (domain instanceof Table) {
      for (let i = 0; i < domain.rows.length; i++) {
        const row = domain.rows[i]!;
        if (!visit(new SiftRecord(new Map(domain.columns.map((c, k) => [c, row[k]!]))), i / domain.rows.length)) return false;
      }
      return true;
    }
    throw typeError(`cannot run over a ${typeName(domain)}; use a range, a prime range, a tuple, a series or a table`, span);
  }

  private bigOp(e: Extract<Expr, { t: 'big' }>, scope: Scope): Value {
    const bits = this.opts.limits.maxBits;
    switch (e.op) {
      case 'sum':
      case 'prod': {
        let acc: Value = e.op === 'sum' ? 0n : 1n;
        this.iterate(e.binders, scope, e.span, (s) => {
          const v = this.expr(e.body, s);
          acc = e.op === 'sum' ? A.add(acc, v, e.body.span) : A.mul(acc, v, e.body.span, bits);
          return true;
        });
        return acc;
      }
      case 'all':
      case 'any': {
        let result = e.op === 'all';
        this.iterate(e.binders, scope, e.span, (s) => {
          const v = this.expr(e.body, s);
          if (typeof v !== 'boolean') throw typeError(`${e.op === 'all' ? '∀' : '∃'}[…] needs a condition, got ${typeName(v)}`, e.body.span);
          if (v !== result) {
            result = v;
            return false;
          }
          return true;
        });
        return result;
      }
      case 'count': {
        let n = 0n;
        this.iterate(e.binders, scope, e.span, (s) => {
          const v = this.expr(e.body, s);
          if (typeof v !== 'boolean') throw typeError(`#[…] counts where a condition holds; got ${typeName(v)}`, e.body.span);
          if (v) n++;
          return true;
        });
        return n;
      }
      case 'table': {
        this.checkSize(this.estimate(e.binders, scope), e.span);
        const rows: Value[] = [];
        this.iterate(e.binders, scope, e.span, (s) => {
          rows.push(this.expr(e.body, s));
          if (rows.length > this.opts.limits.maxElements) throw this.tooMany(e.span);
          return true;
        });
        return this.tableFromRows(rows, e.body.span);
      }
    }
  }

  tableFromRows(rows: Value[], span: SourceSpan): Table {
    if (rows.length === 0) return new Table([], []);
    const firstRow = rows[0];
    if (!(firstRow instanceof SiftRecord)) throw typeError(`a table is built from records such as (p: 5, n: 2), got ${typeName(firstRow!)}`, span);
    const columns = [...firstRow.fields.keys()];
    const out: Value[][] = [];
    for (const r of rows) {
      if (!(r instanceof SiftRecord)) throw typeError(`every row must be a record, got ${typeName(r)}`, span);
      if (r.fields.size !== columns.length || columns.some((c) => !r.fields.has(c))) {
        throw typeError(`every row must have the fields ${columns.join(', ')}`, span);
      }
      out.push(columns.map((c) => r.fields.get(c)!));
    }
    return new Table(columns, out);
  }

  // ---------------------------------------------------------------- calls

  private call(e: Extract<Expr, { t: 'call' }>, scope: Scope): Value {
    const local = scope.lookup(e.name);
    if (local instanceof UserFn) {
      if (e.args.length !== local.params.length) {
        throw typeError(`${e.name} takes ${local.params.length} argument${local.params.length === 1 ? '' : 's'}, got ${e.args.length}`, e.span);
      }
      if (this.callDepth >= this.opts.limits.maxCallDepth) throw limitError(`function calls nest deeper than ${this.opts.limits.maxCallDepth}`, e.span);
      const inner = new Scope(local.scope as Scope);
      local.params.forEach((p, i) => inner.vars.set(p, this.expr(e.args[i]!, scope)));
      this.callDepth++;
      try {
        return this.expr(local.body, inner);
      } finally {
        this.callDepth--;
      }
    }
    if (local !== undefined) throw typeError(`'${e.name}' is a ${typeName(local)}, not a function`, e.nameSpan);
    const b = builtin(e.name);
    if (!b) throw typeError(`unknown function '${e.name}'${didYouMean(e.name, scope.names())}`, e.nameSpan);
    if (e.args.length < b.minArgs || e.args.length > b.maxArgs) {
      const want = b.minArgs === b.maxArgs ? `${b.minArgs}` : `${b.minArgs} to ${b.maxArgs}`;
      throw typeError(`${e.name} takes ${want} argument${b.maxArgs === 1 ? '' : 's'}, got ${e.args.length}: ${b.signature}`, e.span);
    }
    const args = e.args.map((a) => this.expr(a, scope));
    const ctx: CallContext = {
      span: e.span,
      argSpans: e.args.map((a) => a.span),
      limits: this.opts.limits,
      data: this.opts.data,
      tick: (n = 1) => this.tick(e.span, n),
      progress: (f, m) => this.report(f, `${e.name}: ${m}`),
      work: (message) => ({
        onProgress: (f) => this.report(f, `${e.name}: ${message}`),
        // Throws the run's own limit or cancellation error through the engine call.
        shouldStop: () => {
          this.checkpoint(e.span);
          return false;
        },
      }),
    };
    try {
      const v = b.call(args, ctx);
      this.checkInt(v, e.span);
      return v;
    } catch (err) {
      throw asSiftError(err, e.span, e.name);
    }
  }
}

/** Engine errors become Sift errors at the call's position; Sift errors pass through. */
export function asSiftError(err: unknown, span: SourceSpan, fn?: string): unknown {
  if (err instanceof SiftError) return err.span ? err : new SiftError(err.kind, err.message, span);
  if (err instanceof EngineError) {
    const kind = err.kind === 'limit' ? 'limit' : 'domain';
    return new SiftError(kind, fn && !err.message.startsWith(fn) ? `${fn}: ${err.message}` : err.message, span);
  }
  if (err instanceof RangeError && /call stack|Maximum|Invalid array length|BigInt/i.test(err.message)) {
    // Name the cause in the cell's terms, not the JavaScript engine's ("Maximum call stack size exceeded").
    const what = /call stack/i.test(err.message) ? 'the expression nests too deeply' : err.message;
    return limitError(`${fn ? `${fn}: ` : ''}${what}`, span);
  }
  return err;
}

/** First `digits` significant decimal digits of a rational, truncated, with a trailing … if inexact. */
export function decimalDigits(r: Rational, digits: number): string {
  const neg = r.n < 0n;
  let n = neg ? -r.n : r.n;
  const d = r.d;
  const intPart = n / d;
  n %= d;
  let out = intPart.toString();
  let sig = intPart === 0n ? 0 : out.length;
  if (sig >= digits) return (neg ? '-' : '') + out;
  out += '.';
  let frac = '';
  while (sig < digits && n !== 0n) {
    n *= 10n;
    const q = n / d;
    n %= d;
    frac += q.toString();
    if (sig > 0 || q !== 0n) sig++;
  }
  return (neg ? '-' : '') + out + frac + (n !== 0n ? '…' : '');
}

function jsonText(v: ReturnType<typeof valueToJson>): string {
  return valueJsonText(v, { quoteStrings: true });
}
