import { valueJsonText, type SiftOutput, type ValueJson } from '@cribra/lang';
import { RECORD_OUTPUTS_MAX_BYTES, RECORD_UPLOAD_EMBED_MAX_BYTES, type LockRecord, type LockedCell, type RecordClaim } from '@cribra/contracts';

/** Longest run of backticks in `text`, so that a code fence can be longer. */
function fenceFor(text: string): string {
  const longest = Math.max(2, ...[...text.matchAll(/`+/g)].map((m) => m[0].length));
  return '`'.repeat(longest + 1);
}

const v = (x: unknown): string => valueJsonText(x as ValueJson, { quoteStrings: true });
const cellText = (x: unknown): string => valueJsonText(x as ValueJson).replace(/\|/g, '\\|').replace(/\n/g, ' ');
const binding = (b: Array<[string, unknown]> | null): string => (b && b.length ? b.map(([k, x]) => `${k} = ${v(x)}`).join(', ') : '—');

function table(columns: string[], rows: string[][]): string[] {
  return [`| ${columns.join(' | ')} |`, `|${columns.map(() => ' ---: ').join('|')}|`, ...rows.map((r) => `| ${r.join(' | ')} |`)];
}

function outputLines(o: SiftOutput): string[] {
  switch (o.kind) {
    case 'value':
      return ['```', `${o.label ? `${o.label} = ` : ''}${o.text}`, '```'];
    case 'text':
      return [o.text];
    case 'table':
      return [...(o.label ? [`**${o.label}**`, ''] : []), ...table(o.columns, o.rows.map((r) => r.map(cellText)))];
    case 'chart': {
      // Charts as their data: one table per series.
      const head = `Chart (${o.chart}${o.title ? `, "${o.title}"` : ''}): x = ${o.x.label}${o.x.log ? ' (log)' : ''}, y = ${o.y.label}${o.y.log ? ' (log)' : ''}`;
      return [head, ...o.series.flatMap((s) => ['', `Series ${s.name}:`, '', ...table([o.x.label, s.name], s.points.map(([x, y]) => [String(x), y === null ? '—' : String(y)]))])];
    }
    case 'verdict':
      return []; // claims are listed from the record's claims
  }
}

function claimLines(c: RecordClaim): string[] {
  const lines = [`- Claim \`${c.statement}\`${c.label ? ` [${c.label}]` : ''}: **${c.verdict}**`];
  if (c.binders.length) lines.push(`  - binders: ${c.binders.map((b) => `${b.name} ∈ ${b.domain}`).join('; ')}`);
  if (c.conditions.length) lines.push(`  - conditions: ${c.conditions.map((x) => `\`${x}\``).join('; ')}`);
  lines.push(`  - cases checked: ${c.checked}${c.skipped ? ` (${c.skipped} left out by the conditions)` : ''}; first ${binding(c.first)}; last ${binding(c.last)}`);
  if (c.counterexample) {
    const ce = c.counterexample;
    lines.push(`  - first counterexample: ${binding(ce.binding)}: left side ${v(ce.lhs)}${ce.rhs !== null ? `, right side ${v(ce.rhs)}` : ''}${ce.relation ? ` (relation ${ce.relation} fails)` : ''}`);
  }
  lines.push(
    c.verdict === 'holds'
      ? `  - ${c.summary} Checked over ${c.over ?? 'the cases written in the claim'} only: computed evidence for that range, nothing beyond it.`
      : `  - ${c.summary}`,
  );
  return lines;
}

function cellLines(c: LockedCell): string[] {
  const lines: string[] = [`### ${c.position + 1}. ${c.kind} cell${c.title ? `: ${c.title}` : ''}`, ''];
  lines.push(`- cell id \`${c.id}\`${c.cellRevision !== null ? `, revision ${c.cellRevision}` : ''}`);
  lines.push(`- source sha-256: \`${c.sourceSha256}\``);
  lines.push(`- output digest: ${c.outputDigest ? `\`${c.outputDigest}\`` : '— (nothing to run)'}`);
  if (c.runId) lines.push(`- recorded run \`${c.runId}\` (engine ${c.engineVersion ?? '?'}, Sift ${c.languageVersion ?? '?'})`);
  if (c.uploadsRead.length) lines.push(`- reads uploads: ${c.uploadsRead.map((n) => `\`${n}\``).join(', ')}`);
  const fence = fenceFor(c.source);
  lines.push('', `${fence}${c.kind === 'note' ? 'markdown' : 'sift'}`, c.source, fence, '');
  if (c.claims.length) lines.push(...c.claims.flatMap(claimLines), '');
  if (c.outputs) {
    const shown = (c.outputs as unknown as SiftOutput[]).map(outputLines).filter((l) => l.length);
    if (shown.length) lines.push('Outputs:', '', ...shown.flatMap((l) => [...l, '']));
  } else if (c.runId && !c.outputsComplete && c.outputsBytes > 0) {
    lines.push(`Outputs: ${c.outputsBytes} bytes, more than the ${RECORD_OUTPUTS_MAX_BYTES} a record embeds; bound by the output digest above.`, '');
  }
  return lines;
}

/** A lock record as readable Markdown: the same content as the JSON record — what was frozen, who signed, what was checked, and what was not. */
export function lockRecordMarkdown(r: LockRecord, publicUrl: string): string {
  const lines: string[] = [];
  lines.push(`# Lock record: ${r.title}`, '');
  if (r.summary.trim()) lines.push(r.summary.trim(), '');
  lines.push(`- Notebook: ${publicUrl}/notebooks/${r.notebookId} (id \`${r.notebookId}\`)`);
  if (r.authors.length) lines.push(`- Authors: ${r.authors.map((a) => `${a.displayName}${a.role === 'owner' ? ' (owner)' : ''}`).join(', ')}`);
  if (r.tags.length) lines.push(`- Tags: ${r.tags.join(', ')}`);
  lines.push(`- Locked by ${r.lockedBy.displayName} at ${r.lockedAt}`);
  lines.push(`- Notebook revision ${r.notebookRevision}`);
  lines.push(`- Revision digest (${r.digestVersion}): \`${r.revisionDigest}\``);
  lines.push(`- Engine ${r.engineVersion}, Sift ${r.languageVersion} (server that locked)`);
  lines.push(`- Versions recorded on the runs: engine ${r.runEngineVersions.join(', ') || '—'}; Sift ${r.runLanguageVersions.join(', ') || '—'}`);
  lines.push(`- Record (${r.recordVersion}) SHA-256: \`${r.recordSha256}\``);
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
    const ver = s.verification
      ? ` (re-verify \`${s.verification.id}\` of ${s.verification.startedAt}: ${s.verification.cellsSame} of ${s.verification.cellsRerun} cells the same)`
      : s.verificationId ? ` (re-verify \`${s.verificationId}\`)` : '';
    lines.push(`- ${s.user.displayName}, ${s.signedAt}${ver}${s.revisionDigest ? `, on digest \`${s.revisionDigest}\`` : ''}`);
    if (s.comment.trim()) lines.push(`  > ${s.comment.trim().replace(/\n/g, '\n  > ')}`);
  }
  lines.push('');
  lines.push('## Cells', '');
  for (const c of r.cells) lines.push(...cellLines(c));
  if (r.uploads.length) {
    lines.push('## Uploads read by the cells', '');
    for (const u of r.uploads) {
      lines.push(`- \`${u.name}\` (${u.originalName}, ${u.kind}, ${u.mediaType}, ${u.sizeBytes} bytes, ${u.rowCount} rows${u.columns ? `, columns ${u.columns.join(', ')}` : ''})`);
      lines.push(`  - sha-256 \`${u.sha256}\``);
      lines.push(`  - ${u.content ? 'content embedded in the JSON record' : `content not embedded (larger than ${RECORD_UPLOAD_EMBED_MAX_BYTES} bytes)`}`);
    }
    lines.push('');
  }
  lines.push('## How to check it', '');
  lines.push(
    'Anyone can re-run this record offline: `cribra verify RECORD.json` (the JSON export) checks the record\'s own hash, ' +
      're-runs every query and claim cell with the local engine (uploads from their embedded contents) and compares the ' +
      'output digests. Anyone with access to the notebook can also re-run it in Cribra (POST /api/notebooks/:id/lock/checks, ' +
      'or "check" in the review panel). The revision digest is the SHA-256 of `cribra-revision-v1\\n` followed by the JSON ' +
      'array of [cell id, kind, position, source, output digest] in position order; the record hash is the SHA-256 of the ' +
      'canonical JSON of the record without `recordSha256` (docs/records.md).',
  );
  lines.push('');
  return lines.join('\n');
}
