import type { LockRecord } from '@cribra/contracts';

/** Longest run of backticks in `text`, so that a code fence can be longer. */
function fenceFor(text: string): string {
  const longest = Math.max(2, ...[...text.matchAll(/`+/g)].map((m) => m[0].length));
  return '`'.repeat(longest + 1);
}

/** A lock record as readable Markdown: what was frozen, who signed, what was checked — and what was not. */
export function lockRecordMarkdown(r: LockRecord, publicUrl: string): string {
  const lines: string[] = [];
  lines.push(`# Lock record: ${r.title}`, '');
  lines.push(`- Notebook: ${publicUrl}/notebooks/${r.notebookId} (id \`${r.notebookId}\`)`);
  lines.push(`- Locked by ${r.lockedBy.displayName} at ${r.lockedAt}`);
  lines.push(`- Notebook revision ${r.notebookRevision}`);
  lines.push(`- Revision digest (${r.digestVersion}): \`${r.revisionDigest}\``);
  lines.push(`- Engine ${r.engineVersion}, Sift ${r.languageVersion} (server that locked)`);
  lines.push(`- Versions recorded on the runs: engine ${r.runEngineVersions.join(', ') || '—'}; Sift ${r.runLanguageVersions.join(', ') || '—'}`);
  lines.push('');
  lines.push('## What this record means', '');
  lines.push(
    'Computed evidence is not a proof. This record states that the cells below, re-run from their source ' +
      'by the signers, produced outputs with the recorded digests. A claim that "holds" was checked only over the ' +
      'range written in the claim itself; nothing is asserted beyond that range.',
  );
  lines.push('');
  lines.push('## What was checked', '');
  lines.push(
    `Each signer ran a re-verify: every query and claim cell was executed again from its source with the engine and ` +
      `Sift versions above, and each output digest was equal to the recorded one. ${r.signers.length} of the ` +
      `${r.requiredSignoffs} required sign-off(s) were given on this exact revision digest.`,
  );
  lines.push('');
  lines.push('## Signers', '');
  for (const s of r.signers) {
    lines.push(`- ${s.user.displayName}, ${s.signedAt}${s.verificationId ? ` (re-verify \`${s.verificationId}\`)` : ''}`);
    if (s.comment.trim()) lines.push(`  > ${s.comment.trim().replace(/\n/g, '\n  > ')}`);
  }
  lines.push('');
  lines.push('## Cells', '');
  for (const c of r.cells) {
    lines.push(`### ${c.position + 1}. ${c.kind} cell \`${c.id}\``, '');
    lines.push(`- source sha-256: \`${c.sourceSha256}\``);
    lines.push(`- output digest: ${c.outputDigest ? `\`${c.outputDigest}\`` : '— (nothing to run)'}`);
    if (c.runId) lines.push(`- recorded run \`${c.runId}\` (engine ${c.engineVersion ?? '?'}, Sift ${c.languageVersion ?? '?'})`);
    const fence = fenceFor(c.source);
    lines.push('', `${fence}${c.kind === 'note' ? 'markdown' : 'sift'}`, c.source, fence, '');
  }
  lines.push('## How to check it', '');
  lines.push(
    'Anyone with access to the notebook can re-run it against this record (POST /api/notebooks/:id/lock/checks, or ' +
      '"check" in the review panel). The revision digest is the SHA-256 of `cribra-revision-v1\\n` followed by the JSON ' +
      'array of [cell id, kind, position, source, output digest] in position order; the JSON export of this record ' +
      'holds everything needed to recompute it.',
  );
  lines.push('');
  return lines.join('\n');
}
