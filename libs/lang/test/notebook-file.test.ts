import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { diagnose, formatNotebookFile, parseNotebookFile, type NotebookFile } from '../src';

describe('notebook files', () => {
  it('reads header, cells, kinds and titles', () => {
    const r = parseNotebookFile('@@@ title: Gaps\n@@@ tags: wheel\n\n@@ note Intro\nSome *text*.\n\n@@ query\nlet x = 1\nx\n\n\n@@ claim six\nclaim 1 = 1\n');
    expect(r.errors).toEqual([]);
    expect(r.notebook).toEqual({
      title: 'Gaps',
      meta: [['tags', 'wheel']],
      cells: [
        { kind: 'note', title: 'Intro', source: 'Some *text*.' },
        { kind: 'query', title: null, source: 'let x = 1\nx' },
        { kind: 'claim', title: 'six', source: 'claim 1 = 1' },
      ],
    });
    expect(r.cellLines).toEqual([4, 7, 12]);
  });

  it('round-trips, escaping lines that look like markers', () => {
    const nb: NotebookFile = {
      title: 'T',
      meta: [['author', 'a@b.example']],
      cells: [
        { kind: 'note', title: 'n', source: '@@ not a marker\n\\@@ nor this\n@@@ nor this' },
        { kind: 'query', title: null, source: 'show 1' },
      ],
    };
    const text = formatNotebookFile(nb);
    expect(parseNotebookFile(text)).toMatchObject({ notebook: nb, errors: [] });
    expect(formatNotebookFile(parseNotebookFile(text).notebook)).toBe(text);
  });

  it('reports bad markers and stray text with line numbers', () => {
    expect(parseNotebookFile('hello\n@@ sketch\n@@ query\n@@@ title: late').errors).toEqual([
      { line: 1, message: 'text before the first cell marker (@@ query, @@ claim or @@ note)' },
      { line: 2, message: "unknown cell kind 'sketch'; a cell is query, claim or note" },
      { line: 4, message: 'header lines (@@@) belong before the first cell' },
    ]);
  });

  it('the tutorial notebook in seeds-demo parses and its cells have no static errors', () => {
    const path = fileURLToPath(new URL('../../../seeds-demo/sift-tutorial.sift', import.meta.url));
    const r = parseNotebookFile(readFileSync(path, 'utf8'));
    expect(r.errors).toEqual([]);
    expect(r.notebook.cells.map((c) => c.kind)).toContain('claim');
    for (const c of r.notebook.cells.filter((x) => x.kind !== 'note')) expect(diagnose(c.source), c.title ?? '').toEqual([]);
  });
});
