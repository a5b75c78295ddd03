// `cribra verify RECORD`: re-checks a lock record offline — its own hash, then every query and
// claim cell re-run from its source with the local engine, uploads from their embedded content.
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { canonicalJson, MemoryDataProvider, outputsDigest, type RunResult, type SiftOutput } from '@cribra/lang';
import { SiftPool } from '@cribra/lang/node';
import { parseCellRunArgs } from '../cell-run-args';
import type { LockRecord, LockedCell, RecordCheckCell, RecordUpload } from '@cribra/contracts';

const USAGE = 'usage: cribra verify RECORD.json|URL [--json] [--workers N] [--timeout SECONDS]';

interface VerifyArgs {
  source: string;
  json: boolean;
  workers: number;
  timeoutS: number | null;
}

type Io = (s: string) => void;

/** A problem with the record itself (exit 2): unreadable, not a record, bad hash, missing upload content. */
class RecordError extends Error {}

/**
 * Exit codes: 0 every query and claim cell gave its recorded digest; 1 some cell differs or failed
 * to re-run; 2 an error (bad arguments, unreadable record, bad hash, an upload without content).
 */
export async function verifyCommand(argv: string[], out: Io = (s) => process.stdout.write(s), err: Io = (s) => process.stderr.write(s)): Promise<number> {
  let args: VerifyArgs;
  try {
    args = parseArgs(argv);
  } catch (e) {
    err(`${(e as Error).message}\n${USAGE}\n`);
    return 2;
  }
  const started = Date.now();
  let record: LockRecord;
  let data: MemoryDataProvider;
  try {
    record = parseRecord(await readRecord(args.source));
    checkHash(record);
    data = uploadData(record);
  } catch (e) {
    if (e instanceof RecordError) {
      err(`cribra verify: ${e.message}\n`);
      return 2;
    }
    throw e;
  }

  const runnable = record.cells.filter((c) => c.kind !== 'note');
  const pool = new SiftPool({
    threads: Math.max(1, Math.min(args.workers, runnable.length || 1)),
    limits: args.timeoutS ? { maxMillis: args.timeoutS * 1000 } : {},
  });
  const results = new Map<string, RunResult>();
  try {
    await Promise.all(runnable.map(async (c) => results.set(c.id, await pool.run(c.source, { data: data.asProvider() }))));
  } finally {
    await pool.close();
  }
  const cells = record.cells.map((c) => judge(c, results.get(c.id)));
  const counts = { same: 0, differs: 0, failed: 0, skipped: 0 };
  for (const c of cells) counts[c.status]++;
  const revision = revisionCheck(record);
  const exitCode = counts.differs || counts.failed || revision.same === false ? 1 : 0;
  const millis = Date.now() - started;

  if (args.json) {
    out(`${JSON.stringify({
      record: args.source,
      title: record.title,
      notebookId: record.notebookId,
      recordVersion: record.recordVersion ?? null,
      recordSha256: record.recordSha256,
      hashOk: true,
      revisionDigest: record.revisionDigest,
      revision,
      cells,
      counts,
      exitCode,
      millis,
    }, null, 2)}\n`);
    return exitCode;
  }
  out(`${record.title}\nrecord ${record.recordSha256} — hash ok\n`);
  for (const c of cells) {
    out(`\n── cell ${c.position + 1} · ${c.kind}${c.title ? ` · ${c.title}` : ''}: ${c.status.toUpperCase()}\n`);
    if (c.status === 'skipped') continue;
    out(`   recorded ${c.recordedDigest ?? '—'}\n   re-run   ${c.newDigest ?? '—'}\n`);
    if (c.note) out(`   ${c.note}\n`);
  }
  if (revision.same === null) out(`\nrevision digest: not checked (${record.digestVersion ?? 'no digest version'})\n`);
  else out(`\nrevision digest ${revision.same ? 'same' : 'DIFFERS'}: recorded ${record.revisionDigest}, from the cells ${revision.computed}\n`);
  out(`cells: ${counts.same} same, ${counts.differs} differ, ${counts.failed} failed, ${counts.skipped} notes · ${millis} ms\n`);
  return exitCode;
}

/**
 * The revision digest the sign-offs bind to, recomputed from the record's cells (docs/permissions.md):
 * SHA-256 of `cribra-revision-v1\n` + JSON of [id, kind, position, source, outputDigest] per cell.
 * `same` is null for another digest version.
 */
function revisionCheck(record: LockRecord): { computed: string | null; same: boolean | null } {
  if (record.digestVersion !== 'cribra-revision-v1') return { computed: null, same: null };
  const cells = [...record.cells].sort((a, b) => a.position - b.position).map((c) => [c.id, c.kind, c.position, c.source, c.outputDigest]);
  const computed = createHash('sha256').update(`cribra-revision-v1\n${JSON.stringify(cells)}`, 'utf8').digest('hex');
  return { computed, same: computed === record.revisionDigest };
}

/** same / differs / failed / skipped for one cell of the record. */
function judge(c: LockedCell, r: RunResult | undefined): RecordCheckCell {
  const base = { position: c.position, cellId: c.id, kind: c.kind, title: c.title ?? null, recordedDigest: c.outputDigest };
  if (c.kind === 'note') return { ...base, status: 'skipped', newDigest: null, note: null };
  if (typeof c.sourceSha256 === 'string' && createHash('sha256').update(c.source, 'utf8').digest('hex') !== c.sourceSha256) {
    return { ...base, status: 'differs', newDigest: r?.digest ?? null, note: 'the source does not match its recorded sha-256' };
  }
  if (!r || r.error) {
    return { ...base, status: 'failed', newDigest: null, note: r?.error ? `the re-run failed (${r.error.kind}): ${r.error.message}` : 'not run' };
  }
  if (c.outputDigest === null) return { ...base, status: 'differs', newDigest: r.digest, note: 'the record holds no output digest for this cell' };
  if (c.outputsComplete && c.outputs && outputsDigest(c.outputs as unknown as SiftOutput[]) !== c.outputDigest) {
    return { ...base, status: 'differs', newDigest: r.digest, note: 'the recorded outputs do not match their recorded digest' };
  }
  if (r.digest !== c.outputDigest) return { ...base, status: 'differs', newDigest: r.digest, note: 'outputs differ' };
  return { ...base, status: 'same', newDigest: r.digest, note: null };
}

async function readRecord(source: string): Promise<string> {
  if (/^https?:\/\//i.test(source)) {
    let res: Response;
    try {
      res = await fetch(source, { headers: { accept: 'application/json' } });
    } catch (e) {
      throw new RecordError(`cannot fetch ${source}: ${(e as { cause?: { code?: string } }).cause?.code ?? (e as Error).message}`);
    }
    if (!res.ok) throw new RecordError(`cannot fetch ${source}: HTTP ${res.status}`);
    return res.text();
  }
  try {
    return readFileSync(source, 'utf8');
  } catch (e) {
    throw new RecordError(`cannot read ${source}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}`);
  }
}

function parseRecord(text: string): LockRecord {
  let r: unknown;
  try {
    r = JSON.parse(text);
  } catch (e) {
    throw new RecordError(`not JSON: ${(e as Error).message}`);
  }
  const rec = r as Partial<LockRecord> | null;
  if (!rec || typeof rec !== 'object' || !Array.isArray(rec.cells) || typeof rec.recordSha256 !== 'string') {
    throw new RecordError('not a lock record (it needs cells and recordSha256; see docs/records.md)');
  }
  for (const [i, c] of rec.cells.entries()) {
    if (!c || typeof c.source !== 'string' || typeof c.kind !== 'string') throw new RecordError(`cell ${i + 1} of the record has no kind or source`);
  }
  return rec as LockRecord;
}

/** The record's own hash: SHA-256 of the canonical JSON without recordSha256 (docs/records.md). */
function checkHash(record: LockRecord): void {
  const { recordSha256, ...rest } = record;
  const computed = createHash('sha256').update(canonicalJson(rest), 'utf8').digest('hex');
  if (computed !== recordSha256) {
    throw new RecordError(`the record's hash does not match: it says ${recordSha256}, its content hashes to ${computed} (the record was changed after it was made)`);
  }
}

/** Uploads from their embedded content; every upload a cell reads must have it. */
function uploadData(record: LockRecord): MemoryDataProvider {
  const data = new MemoryDataProvider();
  const uploads = new Map<string, RecordUpload>((record.uploads ?? []).map((u) => [u.name, u]));
  for (const u of uploads.values()) {
    if (!u.content) continue;
    data.addUpload(u.name, u.content.kind === 'tuples' ? { kind: 'tuples', values: u.content.values.map((v) => BigInt(v)) } : u.content);
  }
  for (const c of record.cells) {
    for (const name of c.uploadsRead ?? []) {
      const u = uploads.get(name);
      if (!u) throw new RecordError(`cell ${c.position + 1} reads upload "${name}", which the record does not list`);
      if (!u.content) throw new RecordError(`upload "${name}" (${u.sizeBytes} bytes, sha-256 ${u.sha256}) has no embedded content; cell ${c.position + 1} reads it`);
    }
  }
  return data;
}

function parseArgs(argv: string[]): VerifyArgs {
  const { input, ...rest } = parseCellRunArgs(argv, { missing: 'no record given', positive });
  return { source: input, ...rest };
}

function positive(v: string, name: string): number {
  const n = Number(v);
  if (!Number.isInteger(n) || n < 1 || n > 256) throw new Error(`${name} must be an integer 1 … 256, got ${v}`);
  return n;
}
