import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { CellKind, NotebookView, RunOutput } from '@cribra/contracts';
import { evaluate, MemoryDataProvider, parseNotebookFile, type StoredUpload } from '@cribra/lang';

export interface Compiled {
  /** pdflatex's exit code (0 = no error). */
  status: number | null;
  /** The `! …` error lines of the log, with the line after each. */
  errors: string[];
  /** The PDF's text read back by pdftotext (empty when no PDF was written). */
  text: string;
  /** The same with pdftotext -layout: table rows stay on one line. */
  layout: string;
  pages: number;
  /** Folder holding doc.tex, doc.log and doc.pdf (removed by `cleanup`). */
  dir: string;
  cleanup(): void;
}

/**
 * Compiles a LaTeX document with pdflatex (twice, as longtable needs) in a fresh folder and reads
 * the PDF's text back with pdftotext. The test launcher installs Debian's TeX Live and poppler-utils.
 */
export function compileLatex(tex: string, keep = false): Compiled {
  const dir = mkdtempSync(join(tmpdir(), 'cribra-latex-'));
  writeFileSync(join(dir, 'doc.tex'), tex);
  let status: number | null = null;
  for (let pass = 0; pass < 2; pass++) {
    const r = spawnSync('pdflatex', ['-interaction=nonstopmode', '-halt-on-error', '-no-shell-escape', 'doc.tex'], { cwd: dir, encoding: 'utf8', timeout: 120_000 });
    status = r.status;
    if (status !== 0) break;
  }
  const log = readFileSync(join(dir, 'doc.log'), 'latin1').split('\n');
  const errors = log.flatMap((l, i) => (l.startsWith('!') ? [`${l} ${log[i + 1] ?? ''}`.trim()] : []));
  let text = '';
  let layout = '';
  let pages = 0;
  try {
    text = execFileSync('pdftotext', ['-enc', 'UTF-8', join(dir, 'doc.pdf'), '-'], { encoding: 'utf8' });
    layout = execFileSync('pdftotext', ['-layout', '-enc', 'UTF-8', join(dir, 'doc.pdf'), '-'], { encoding: 'utf8' });
    pages = Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [join(dir, 'doc.pdf')], { encoding: 'utf8' }))?.[1] ?? 0);
  } catch {
    /* no PDF */
  }
  const cleanup = () => rmSync(dir, { recursive: true, force: true });
  if (!keep && status === 0) cleanup();
  return { status, errors, text, layout, pages, dir, cleanup };
}

/** pdftotext's words joined by single spaces (line ends and hyphenation do not matter then). */
export const flat = (text: string): string => text.replace(/\s+/g, ' ');

const now = new Date().toISOString();
const user = { id: '00000000-0000-4000-8000-000000000001', displayName: 'Teodor Quill' };

/**
 * A notebook view built from a `.sift` file whose query and claim cells were run here with the
 * local engine (as `cribra run` does), in the shape the API's export reads.
 */
export function notebookFromFile(text: string, uploads: Record<string, StoredUpload> = {}): NotebookView {
  const parsed = parseNotebookFile(text);
  if (parsed.errors.length) throw new Error(`bad notebook file: ${JSON.stringify(parsed.errors)}`);
  const data = new MemoryDataProvider();
  for (const [name, u] of Object.entries(uploads)) data.addUpload(name, u);
  const nb = parsed.notebook;
  const notebookId = '00000000-0000-4000-8000-0000000000aa';
  return {
    id: notebookId,
    title: nb.title ?? 'Untitled',
    summary: nb.meta.find(([k]) => k === 'summary')?.[1] ?? '',
    tags: [],
    status: 'draft',
    revision: 1,
    owner: user,
    requiredSignoffs: 1,
    createdAt: now,
    updatedAt: now,
    members: [],
    cells: nb.cells.map((c, i) => {
      const id = `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`;
      const r = c.kind === 'note' ? null : evaluate(c.source, { data });
      return {
        id,
        notebookId,
        kind: c.kind as CellKind,
        source: c.source,
        position: i,
        revision: 1,
        author: user,
        createdAt: now,
        updatedAt: now,
        latestRun: r && {
          id: `10000000-0000-4000-8000-${String(i).padStart(12, '0')}`,
          notebookId,
          cellId: id,
          cellRevision: 1,
          purpose: 'run',
          status: r.error ? 'failed' : 'succeeded',
          progress: 1,
          progressNote: null,
          outputs: r.outputs as unknown as RunOutput[],
          outputDigest: r.digest,
          engineVersion: r.engineVersion,
          languageVersion: r.languageVersion,
          runnerId: 'test',
          attempts: 1,
          requestedBy: user,
          queuedAt: now,
          startedAt: now,
          finishedAt: now,
          durationMs: r.millis,
          error: r.error as never,
        },
      };
    }),
  } as unknown as NotebookView;
}
