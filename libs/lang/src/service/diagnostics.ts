import '../builtins';
import { builtin } from '../builtins/registry';
import type { SiftErrorKind, SourceSpan } from '../errors';
import type { Binder, Expr, Stmt } from '../syntax/ast';
import { didYouMean } from '../runtime/suggest';
import { parse } from '../syntax/parse';

export interface Diagnostic {
  severity: 'error' | 'warning';
  kind: SiftErrorKind;
  message: string;
  offset: number;
  line: number;
  column: number;
  length: number;
}

type Env = Map<string, { params: number | null }>;

/**
 * Every problem found without running the cell: syntax errors (all statements), unknown names and
 * functions, wrong numbers of arguments, names that hide a builtin. Errors a run can meet
 * (domains, limits) are not predicted.
 */
export function diagnose(source: string): Diagnostic[] {
  const parsed = parse(source);
  const out: Diagnostic[] = parsed.errors.map((e) => at(e.span ?? { offset: 0, line: 1, column: 1, length: 0 }, e.kind, e.message));
  const env: Env = new Map();
  for (const stmt of parsed.program.statements) checkStmt(stmt, env, out);
  return out.sort((a, b) => a.offset - b.offset);
}

function at(span: SourceSpan, kind: SiftErrorKind, message: string, severity: 'error' | 'warning' = 'error'): Diagnostic {
  return { severity, kind, message, offset: span.offset, line: span.line, column: span.column, length: Math.max(1, span.length) };
}

function checkStmt(stmt: Stmt, env: Env, out: Diagnostic[]): void {
  switch (stmt.t) {
    case 'let': {
      if (refusedName(stmt.name)) out.push(at(stmt.span, 'type', `'${stmt.name}' is the name of a builtin; choose another name`));
      if (stmt.params) {
        const inner = new Map(env);
        for (const p of stmt.params) inner.set(p, { params: null });
        checkExpr(stmt.value, inner, out);
        env.set(stmt.name, { params: stmt.params.length });
      } else {
        checkExpr(stmt.value, env, out);
        env.set(stmt.name, { params: null });
      }
      return;
    }
    case 'claim': {
      const inner = checkBinders(stmt.binders, env, out);
      checkExpr(stmt.body, inner, out);
      return;
    }
    case 'draw':
      checkExpr(stmt.source, env, out);
      return;
    default:
      checkExpr(stmt.value, env, out);
  }
}

function checkBinders(binders: Binder[], env: Env, out: Diagnostic[]): Env {
  const inner = new Map(env);
  for (const b of binders) {
    if (b.t === 'bind') {
      checkExpr(b.domain, inner, out);
      if (refusedName(b.name)) out.push(at(b.span, 'type', `'${b.name}' is the name of a builtin; choose another name`));
      inner.set(b.name, { params: null });
    } else checkExpr(b.cond, inner, out);
  }
  return inner;
}

/** A builtin's name a cell may not bind (names added later yield to the cell's own). */
function refusedName(name: string): boolean {
  const b = builtin(name);
  return b !== undefined && !b.yieldsToCellNames;
}

function checkExpr(e: Expr, env: Env, out: Diagnostic[]): void {
  switch (e.t) {
    case 'name': {
      const v = env.get(e.name);
      if (!v) out.push(at(e.span, 'type', builtin(e.name) ? `'${e.name}' is a builtin function; call it as ${e.name}(…)` : `unknown name '${e.name}'${didYouMean(e.name, env.keys())}`));
      else if (v.params !== null) out.push(at(e.span, 'type', `'${e.name}' is a function; call it as ${e.name}(…)`));
      return;
    }
    case 'call': {
      e.args.forEach((a) => checkExpr(a, env, out));
      const user = env.get(e.name);
      if (user) {
        if (user.params === null) out.push(at(e.nameSpan, 'type', `'${e.name}' is a value, not a function`));
        else if (user.params !== e.args.length) out.push(at(e.span, 'type', `${e.name} takes ${user.params} argument${user.params === 1 ? '' : 's'}, got ${e.args.length}`));
        return;
      }
      const b = builtin(e.name);
      if (!b) out.push(at(e.nameSpan, 'type', `unknown function '${e.name}'${didYouMean(e.name, env.keys())}`));
      else if (e.args.length < b.minArgs || e.args.length > b.maxArgs) out.push(at(e.span, 'type', `${e.name} takes ${b.minArgs === b.maxArgs ? b.minArgs : `${b.minArgs} to ${b.maxArgs}`} arguments, got ${e.args.length}: ${b.signature}`));
      return;
    }
    case 'builder':
    case 'big': {
      const inner = checkBinders(e.binders, env, out);
      checkExpr(e.t === 'builder' ? e.head : e.body, inner, out);
      return;
    }
    default:
      for (const child of children(e)) checkExpr(child, env, out);
  }
}

function children(e: Expr): Expr[] {
  switch (e.t) {
    case 'tuple':
    case 'series':
      return e.items;
    case 'record':
      return e.fields.map((f) => f.value);
    case 'index':
      return [e.target, e.index];
    case 'field':
      return [e.target];
    case 'postfix':
    case 'neg':
    case 'not':
      return [e.arg];
    case 'arith':
    case 'compare':
      return [e.first, ...e.rest.map((r) => r.rhs)];
    case 'pow':
      return [e.base, e.exp];
    case 'logic':
      return e.items;
    case 'range':
      return [e.lo, e.hi];
    case 'if':
      return [e.cond, e.then, e.otherwise];
    default:
      return [];
  }
}
