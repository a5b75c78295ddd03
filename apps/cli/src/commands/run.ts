// `cribra run FILE`: runs a notebook file's query and claim cells headlessly in the Sift worker pool.
import { readFileSync } from 'node:fs';
import {
  errorTitle, MemoryDataProvider, parseNotebookFile, type NotebookFileCell, type RunResult, type SiftOutput, type ValueJson,
  type VerdictContext, valueJsonText, verdictSentence,
} from '@cribra/lang';
import { SiftPool } from '@cribra/lang/node';
import { parseCellRunArgs } from '../cell-run-args';

const USAGE = 'usage: cribra run FILE [--json] [--workers N] [--timeout SECONDS] [--upload NAME=FILE]…';

interface RunArgs {
  file: string;
  json: boolean;
  workers: number;
  timeoutS: number | null;
  uploads: Array<[string, string]>;
}

/** Exit codes: 0 all ran and every claim holds; 1 a claim fails; 2 an error (bad file, a cell error). */
export async function runCommand(argv: string[], out: (s: string) => void = (s) => process.stdout.write(s), err: (s: string) => void = (s) => process.stderr.write(s)): Promise<number> {
  let args: RunArgs;
  try {
    args = parseArgs(argv);
  } catch (e) {
    err(`${(e as Error).message}\n${USAGE}\n`);
    return 2;
  }
  let text: string;
  try {
    text = readFileSync(args.file, 'utf8');
  } catch (e) {
    err(`cannot read ${args.file}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}\n`);
    return 2;
  }
  const parsed = parseNotebookFile(text);
  if (parsed.errors.length) {
    for (const e of parsed.errors) err(`${args.file}:${e.line}: ${e.message}\n`);
    return 2;
  }
  const data = new MemoryDataProvider();
  for (const [name, path] of args.uploads) {
    try {
      data.addUpload(name, readUpload(path));
    } catch (e) {
      err(`cannot read upload ${name} from ${path}: ${(e as Error).message}\n`);
      return 2;
    }
  }
  const cells = parsed.notebook.cells.map((cell, i) => ({ cell, index: i + 1, line: parsed.cellLines[i]! }));
  const runnable = cells.filter((c) => c.cell.kind !== 'note');
  const pool = new SiftPool({ threads: Math.max(1, Math.min(args.workers, runnable.length)), limits: args.timeoutS ? { maxMillis: args.timeoutS * 1000 } : {} });
  let results: Map<number, RunResult>;
  try {
    const done = await Promise.all(runnable.map(async (c) => [c.index, await pool.run(c.cell.source, { data: data.asProvider() })] as const));
    results = new Map(done);
  } finally {
    await pool.close();
  }
  let failedClaims = 0;
  let heldClaims = 0;
  let errors = 0;
  for (const r of results.values()) {
    if (r.error) errors++;
    for (const o of r.outputs) if (o.kind === 'verdict') (o.holds ? heldClaims++ : failedClaims++);
  }
  const exitCode = errors ? 2 : failedClaims ? 1 : 0;
  if (args.json) {
    out(`${JSON.stringify({
      file: args.file,
      title: parsed.notebook.title,
      cells: cells.map(({ cell, index, line }) => {
        const r = results.get(index);
        return { index, line, kind: cell.kind, title: cell.title, ...(r ? { ok: r.ok, outputs: r.outputs, digest: r.digest, error: r.error, millis: r.millis } : {}) };
      }),
      claims: { holds: heldClaims, fails: failedClaims },
      errors,
      exitCode,
    }, null, 2)}\n`);
    return exitCode;
  }
  if (parsed.notebook.title) out(`${parsed.notebook.title}\n`);
  const notes = parsed.notebook.cells.filter((c) => c.kind === 'note').map((c) => c.source);
  for (const { cell, index, line } of cells) {
    out(`\n── cell ${index} · ${cell.kind}${cell.title ? ` · ${cell.title}` : ''} (line ${line})\n`);
    const r = results.get(index);
    if (!r) {
      out(indent(cell.source.split('\n').slice(0, 3).join('\n') + (cell.source.split('\n').length > 3 ? '\n…' : '')));
      continue;
    }
    for (const o of r.outputs) out(indent(renderOutput(o, { title: cell.title, notes })));
    // Every syntax error of the cell (the editor marks the same), else the error that stopped it.
    const shown = r.diagnostics.length ? r.diagnostics : r.error ? [r.error] : [];
    for (const e of shown) {
      const where = 'line' in e && e.line ? ` at line ${line + e.line}, column ${e.column}` : '';
      out(indent(`${errorTitle(e.kind)}${where}: ${e.message}`));
    }
    out(`   digest ${r.digest.slice(0, 16)} · ${r.millis} ms\n`);
  }
  out(`\nclaims: ${heldClaims} hold, ${failedClaims} fail; cell errors: ${errors}\n`);
  return exitCode;
}

function parseArgs(argv: string[]): RunArgs {
  const uploads: Array<[string, string]> = [];
  const { input, ...rest } = parseCellRunArgs(argv, {
    missing: 'no notebook file given',
    positive,
    extra: (flag, value) => {
      if (flag !== '--upload') return false;
      const v = value();
      const eq = v.indexOf('=');
      if (eq <= 0) throw new Error('--upload takes NAME=FILE');
      uploads.push([v.slice(0, eq), v.slice(eq + 1)]);
      return true;
    },
  });
  return { file: input, ...rest, uploads };
}

function positive(v: string, name: string): number {
  const n = Number(v);
  if (!Number.isInteger(n) || n < 1) throw new Error(`${name} must be a positive integer, got ${v}`);
  return n;
}

/** `.csv` → table (header row, comma separated, no quoting); anything else → one integer per line. */
function readUpload(path: string) {
  const text = readFileSync(path, 'utf8');
  const lines = text.split(/\r?\n/).filter((l) => l.trim() !== '' && !l.trim().startsWith('#'));
  if (path.toLowerCase().endsWith('.csv')) {
    const [head, ...rows] = lines.map((l) => l.split(',').map((c) => c.trim()));
    return { kind: 'table' as const, columns: head ?? [], rows };
  }
  return {
    kind: 'tuples' as const,
    values: lines.map((l, i) => {
      if (!/^[+-]?\d+$/.test(l.trim())) throw new Error(`line ${i + 1} is not an integer`);
      return BigInt(l.trim());
    }),
  };
}

function indent(s: string): string {
  return `${s.split('\n').map((l) => `   ${l}`).join('\n')}\n`;
}

const text = (v: ValueJson): string => valueJsonText(v);

/** Plain-text rendering of one output for the terminal (a verdict's sentence looks at its cell's title and the notes). */
export function renderOutput(o: SiftOutput, context: VerdictContext = {}): string {
  switch (o.kind) {
    case 'value':
      return `${o.label ? `${o.label} = ` : ''}${o.text}`;
    case 'text':
      return o.text;
    case 'table': {
      const rows = o.rows.map((r) => r.map(text));
      const widths = o.columns.map((c, i) => Math.max(c.length, ...rows.map((r) => r[i]!.length)));
      const line = (cells: string[]) => cells.map((c, i) => c.padStart(widths[i]!)).join('  ');
      return [o.label ?? '', line(o.columns), ...rows.map(line)].filter((l, i) => i > 0 || l).join('\n');
    }
    case 'chart':
      return `chart (${o.chart}${o.title ? `, "${o.title}"` : ''}): ${o.x.label}${o.x.log ? ' (log)' : ''} → ${o.series.map((s) => `${s.name} (${s.points.length} points)`).join(', ')}${o.y.log ? ', log y' : ''}`;
    case 'verdict':
      return `${o.holds ? 'HOLDS' : 'FAILS'}${o.label ? ` [${o.label}]` : ''}: ${verdictSentence(o, context)}`;
  }
}

export type { NotebookFileCell };
