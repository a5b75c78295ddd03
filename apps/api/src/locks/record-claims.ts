import { parse, type Binder, type Expr, type Stmt, type VerdictOutput } from '@cribra/lang';
import type { RecordBinder, RecordClaim, RunOutput } from '@cribra/contracts';

interface ClaimSyntax {
  text: string;
  binders: RecordBinder[];
  conditions: string[];
}

const slice = (source: string, e: { span: { offset: number; length: number } }): string =>
  source.slice(e.span.offset, e.span.offset + e.span.length).trim();

/** Every `claim` statement of a source with its binders and conditions as written (none when it does not parse). */
function claimSyntax(source: string): ClaimSyntax[] {
  const { program, errors } = parse(source);
  if (errors.length || !program) return [];
  return program.statements
    .filter((s): s is Extract<Stmt, { t: 'claim' }> => s.t === 'claim')
    .map((s) => ({
      text: s.text,
      binders: s.binders
        .filter((b): b is Extract<Binder, { t: 'bind' }> => b.t === 'bind')
        .map((b) => ({ name: b.name, domain: slice(source, b.domain as Expr) })),
      conditions: s.binders.filter((b): b is Extract<Binder, { t: 'filter' }> => b.t === 'filter').map((b) => slice(source, b.cond as Expr)),
    }));
}

/**
 * The claims of a cell's recorded outputs: each verdict with the binders and ranges of the claim
 * statement that made it (the k-th verdict comes from the k-th claim; by text when they disagree).
 */
export function recordClaims(source: string, outputs: readonly RunOutput[] | null): RecordClaim[] {
  const verdicts = (outputs ?? []).filter((o) => o.kind === 'verdict') as unknown as VerdictOutput[];
  if (!verdicts.length) return [];
  const syntax = claimSyntax(source);
  return verdicts.map((v, k) => {
    const s = syntax.length === verdicts.length ? syntax[k] : syntax.find((x) => x.text === v.statement);
    return {
      label: v.label,
      statement: v.statement,
      verdict: v.holds ? 'holds' : 'fails',
      over: v.over,
      binders: s?.binders ?? [],
      conditions: s?.conditions ?? [],
      checked: v.checked,
      skipped: v.skipped,
      first: v.first,
      last: v.last,
      counterexample: v.counterexample,
      summary: v.summary,
    };
  });
}
