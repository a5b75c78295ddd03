import type { CellKind, NotebookView, PublishedRecordView, RunOutput } from '@cribra/contracts';
import { formatNotebookFile } from '@cribra/lang';
import { latexWriter } from '../exports/latex-writer';
import { markdownWriter } from '../exports/markdown-writer';
import { renderNotebook, type DocumentWriter } from '../exports/notebook-document';

const names = (v: PublishedRecordView): string => v.authors.map((a) => a.displayName).join(', ');

/** The published record in the shape the notebook exports render (cells with their recorded outputs). */
function asNotebook(v: PublishedRecordView): NotebookView {
  const at = v.record.lockedAt;
  const owner = { id: v.authors[0]?.id ?? '', displayName: names(v) };
  return {
    id: v.notebookId,
    title: v.title,
    summary: v.summary,
    tags: [],
    status: 'locked',
    revision: v.record.notebookRevision,
    requiredSignoffs: v.record.requiredSignoffs,
    owner,
    myRole: null,
    cellCount: v.cells.length,
    createdAt: at,
    updatedAt: at,
    members: [],
    cells: v.cells.map((c) => ({
      id: c.id,
      notebookId: v.notebookId,
      kind: c.kind as CellKind,
      source: c.source,
      position: c.position,
      revision: 0,
      author: owner,
      createdAt: at,
      updatedAt: at,
      latestRun:
        c.kind === 'note'
          ? null
          : {
              id: (v.record.cells.find((x) => x.id === c.id)?.runId ?? c.id) as string,
              notebookId: v.notebookId,
              cellId: c.id,
              cellRevision: 0,
              purpose: 'run',
              status: c.outputs ? 'succeeded' : 'failed',
              progress: 1,
              progressNote: null,
              outputs: (c.outputs ?? []) as RunOutput[],
              outputDigest: c.outputDigest,
              engineVersion: v.record.cells.find((x) => x.id === c.id)?.engineVersion ?? null,
              languageVersion: v.record.cells.find((x) => x.id === c.id)?.languageVersion ?? null,
              runnerId: null,
              attempts: 1,
              requestedBy: owner,
              queuedAt: at,
              startedAt: at,
              finishedAt: at,
              durationMs: null,
              error: null,
            },
    })),
  } as unknown as NotebookView;
}

/** Reviewers, hashes, uploads, the way to check it and the citation: after the cells. */
function appendix(v: PublishedRecordView, w: DocumentWriter): string[] {
  const out = [w.heading('The record', 1)];
  if (v.withdrawal) out.push(w.paragraph(`WITHDRAWN on ${v.withdrawal.at} by ${v.withdrawal.by.displayName}: ${v.withdrawal.reason}`));
  out.push(
    w.meta([
      `Address: ${v.url}`,
      `Record SHA-256: ${v.recordSha256}`,
      `Revision digest (${v.record.digestVersion}): ${v.record.revisionDigest}`,
      `Locked by ${v.record.lockedBy.displayName} at ${v.record.lockedAt}; published by ${v.publishedBy.displayName} at ${v.publishedAt}`,
      `Engine ${v.record.engineVersion}, Sift ${v.record.languageVersion}`,
    ]),
  );
  out.push(w.heading('Reviewers', 2));
  out.push(
    v.record.signers.length
      ? w.meta(v.record.signers.map((s) => `${s.user.displayName}, signed off ${s.signedAt}${s.verificationId ? ` (re-verify ${s.verificationId})` : ''}${s.comment.trim() ? `: ${s.comment.trim()}` : ''}`))
      : w.paragraph('No sign-offs are recorded.'),
  );
  if (v.uploads.length) {
    out.push(w.heading('Uploads', 2));
    out.push(w.table(['name', 'type', 'bytes', 'SHA-256'], v.uploads.map((u) => [u.name, u.mediaType, String(u.sizeBytes), u.sha256])));
  }
  out.push(w.heading('Checking it', 2));
  out.push(w.paragraph('Computed evidence is not a proof: each claim holds only over the range it states. Anyone can re-run the record with the local engine:'));
  out.push(w.value(v.verifyCommand));
  out.push(w.heading('How to cite it', 2));
  out.push(w.paragraph(v.citation.text));
  out.push(w.value(v.citation.bibtex));
  return out;
}

const render = (v: PublishedRecordView, w: DocumentWriter): string =>
  renderNotebook(asNotebook(v), w, {
    stamp: `locked ${v.record.lockedAt}; published ${v.publishedAt} at ${v.url}`,
    titles: Object.fromEntries(v.cells.map((c) => [c.id, c.title])),
    appendix: appendix(v, w),
  });

export const recordMarkdown = (v: PublishedRecordView): string => render(v, markdownWriter);
export const recordLatex = (v: PublishedRecordView): string => render(v, latexWriter);

/** The record's notebook as a `.sift` file (title, summary, cells with titles and sources). */
export function recordSift(v: PublishedRecordView): string {
  return formatNotebookFile({
    title: v.title,
    meta: [
      ...(v.summary ? ([['summary', v.summary]] as Array<[string, string]>) : []),
      ['record', v.url],
      ['record-sha256', v.recordSha256],
    ],
    cells: v.cells.map((c) => ({ kind: c.kind as 'note' | 'query' | 'claim', title: c.title, source: c.source })),
  });
}
