// `cribra verify`: a lock record re-checked offline. The records here are built the way the API
// builds them (outputs and digests from Sift's own evaluate, the record hash over the canonical
// JSON without recordSha256), then altered to see each exit code.
import { createHash } from 'node:crypto';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { canonicalJson, evaluate, MemoryDataProvider } from '@cribra/lang';
import type { LockRecord, LockedCell } from '@cribra/contracts';
import { verifyCommand } from '../src/commands/verify';
import { cribra } from './run-cli';

const dir = mkdtempSync(path.join(tmpdir(), 'cribra-verify-'));
const TRIPLE = ['0', '2', '6'];

const CELLS: Array<{ kind: 'query' | 'claim' | 'note'; title: string | null; source: string; uploads?: string[] }> = [
  { kind: 'note', title: 'About', source: 'The admissible triple {0, 2, 6}.' },
  // hits(H, 13) = ∏_{q ≤ 13}(q − ν_q(H)) = 1·1·2·4·8·10 = 640 for H = {0, 2, 6} (docs/language.md).
  { kind: 'query', title: 'Occurrences at level 13', source: 'show hits(upload("triple"), 13) as "hits"', uploads: ['triple'] },
  // OEIS A000040: the 14 primes 3..47 are odd.
  { kind: 'claim', title: 'Odd primes', source: 'claim p mod 2 = 1 over p ∈ primes 3..50' },
];

function hash(r: Omit<LockRecord, 'recordSha256'> & { recordSha256?: string }): string {
  const { recordSha256: _x, ...rest } = r;
  return createHash('sha256').update(canonicalJson(rest), 'utf8').digest('hex');
}

/** The revision digest (docs/permissions.md) of the cells. */
function revisionDigest(cells: LockedCell[]): string {
  const text = `cribra-revision-v1\n${JSON.stringify(cells.map((c) => [c.id, c.kind, c.position, c.source, c.outputDigest]))}`;
  return createHash('sha256').update(text).digest('hex');
}

function makeRecord(): LockRecord {
  const data = new MemoryDataProvider().addUpload('triple', { kind: 'tuples', values: TRIPLE.map(BigInt) });
  const cells: LockedCell[] = CELLS.map((c, position) => {
    const r = c.kind === 'note' ? null : evaluate(c.source, { data });
    if (r && !r.ok) throw new Error(`fixture cell failed: ${r.error?.message}`);
    return {
      id: `00000000-0000-4000-8000-00000000000${position}`,
      position,
      kind: c.kind,
      title: c.title,
      sourceSha256: createHash('sha256').update(c.source).digest('hex'),
      source: c.source,
      cellRevision: r ? 1 : null,
      outputDigest: r?.digest ?? null,
      runId: r ? `00000000-0000-4000-9000-00000000000${position}` : null,
      engineVersion: r?.engineVersion ?? null,
      languageVersion: r?.languageVersion ?? null,
      outputs: r ? (r.outputs as unknown as LockedCell['outputs']) : null,
      outputsComplete: !!r,
      outputsBytes: r ? Buffer.byteLength(canonicalJson(r.outputs)) : 0,
      claims: [],
      uploadsRead: c.uploads ?? [],
    };
  });
  const raw = `${TRIPLE.join('\n')}\n`;
  const record: Omit<LockRecord, 'recordSha256'> = {
    recordVersion: 'cribra-record-v1',
    notebookId: '00000000-0000-4000-8000-000000000100',
    title: 'A triple, offline',
    summary: '',
    tags: [],
    authors: [{ id: '00000000-0000-4000-8000-000000000200', displayName: 'Ilse Marenko', role: 'owner' }],
    notebookRevision: 4,
    revisionDigest: revisionDigest(cells),
    digestVersion: 'cribra-revision-v1',
    lockedBy: { id: '00000000-0000-4000-8000-000000000200', displayName: 'Ilse Marenko' },
    lockedAt: '2026-12-04T12:00:00.000Z',
    signers: [],
    requiredSignoffs: 1,
    engineVersion: cells[1]!.engineVersion!,
    languageVersion: cells[1]!.languageVersion!,
    runEngineVersions: [cells[1]!.engineVersion!],
    runLanguageVersions: [cells[1]!.languageVersion!],
    cells,
    uploads: [{
      name: 'triple', originalName: 'triple.txt', kind: 'tuples', mediaType: 'text/plain', sizeBytes: raw.length,
      sha256: createHash('sha256').update(raw).digest('hex'), rowCount: 3, columns: null, content: { kind: 'tuples', values: TRIPLE },
    }],
  };
  return { ...record, recordSha256: hash(record) };
}

function write(name: string, r: unknown): string {
  const p = path.join(dir, name);
  writeFileSync(p, typeof r === 'string' ? r : `${canonicalJson(r)}\n`);
  return p;
}

/** The record after `change`, with its hash recomputed (as someone altering it on purpose would). */
function altered(change: (r: LockRecord) => void, rehash = true): LockRecord {
  const r = makeRecord();
  change(r);
  if (rehash) r.recordSha256 = hash(r);
  return r;
}

describe('cribra verify', () => {
  it('exits 0 on an untouched record, printing every cell with both digests', () => {
    const record = makeRecord();
    expect((record.cells[1]!.outputs![0] as { text: string }).text).toBe('640');
    const run = cribra('verify', write('ok.json', record), '--workers', '1');
    expect(run.stderr).toBe('');
    expect(run.code).toBe(0);
    expect(run.stdout).toContain(`record ${record.recordSha256} — hash ok`);
    expect(run.stdout).toContain('cell 2 · query · Occurrences at level 13: SAME');
    expect(run.stdout).toContain(`   recorded ${record.cells[1]!.outputDigest}\n   re-run   ${record.cells[1]!.outputDigest}`);
    expect(run.stdout).toContain('cells: 2 same, 0 differ, 0 failed, 1 notes');
    expect(run.stdout).toContain(`revision digest same: recorded ${record.revisionDigest}, from the cells ${record.revisionDigest}`);

    const json = JSON.parse(cribra('verify', write('ok2.json', record), '--json', '--workers', '1').stdout);
    expect(json).toMatchObject({ hashOk: true, exitCode: 0, counts: { same: 2, differs: 0, failed: 0, skipped: 1 }, revision: { same: true } });
    expect(json.cells.map((c: { status: string }) => c.status)).toEqual(['skipped', 'same', 'same']);
    expect(json.cells[2].newDigest).toBe(record.cells[2]!.outputDigest);
  });

  it('exits 1 when a recorded output was altered (hash updated), naming the cell', () => {
    const outputChanged = altered((r) => {
      (r.cells[1]!.outputs![0] as { text: string; value: { v: string } }).text = '641';
      (r.cells[1]!.outputs![0] as { value: { v: string } }).value.v = '641';
    });
    const run = cribra('verify', write('out.json', outputChanged), '--json', '--workers', '1');
    expect(run.code).toBe(1);
    const j = JSON.parse(run.stdout);
    expect(j.cells[1]).toMatchObject({ status: 'differs', note: 'the recorded outputs do not match their recorded digest' });
    expect(j.cells[2].status).toBe('same');

    const digestChanged = altered((r) => {
      r.cells[2]!.outputDigest = 'f'.repeat(64);
    });
    const run2 = cribra('verify', write('digest.json', digestChanged), '--workers', '1');
    expect(run2.code).toBe(1);
    expect(run2.stdout).toContain('cell 3 · claim · Odd primes: DIFFERS');
    expect(run2.stdout).toContain(`   recorded ${'f'.repeat(64)}\n   re-run   ${makeRecord().cells[2]!.outputDigest}`);
    // The reviewers signed the revision digest of the original cells: that no longer matches either.
    expect(run2.stdout).toContain('revision digest DIFFERS');

    // A source changed (and its sha-256 not) is reported even before the digests are compared.
    const sourceChanged = altered((r) => {
      r.cells[1]!.source = 'show hits(upload("triple"), 17) as "hits"';
    });
    const j3 = JSON.parse(cribra('verify', write('source.json', sourceChanged), '--json', '--workers', '1').stdout);
    expect(j3.exitCode).toBe(1);
    expect(j3.cells[1]).toMatchObject({ status: 'differs', note: 'the source does not match its recorded sha-256' });
    expect(j3.revision.same).toBe(false);
  });

  it('exits 2 with a hash error when the record was altered and its hash not updated', () => {
    const r = altered((x) => {
      (x.cells[1]!.outputs![0] as { text: string }).text = '641';
    }, false);
    const run = cribra('verify', write('nohash.json', r), '--workers', '1');
    expect(run.code).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toMatch(new RegExp(`^cribra verify: the record's hash does not match: it says ${r.recordSha256}, its content hashes to [0-9a-f]{64}`));
  });

  it('exits 2 when an upload a cell reads has no embedded content, or the record cannot be read', () => {
    const r = altered((x) => {
      x.uploads[0]!.content = null;
    });
    const run = cribra('verify', write('noupload.json', r), '--workers', '1');
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/upload "triple" \(6 bytes, sha-256 [0-9a-f]{64}\) has no embedded content; cell 2 reads it/);
    expect(cribra('verify', path.join(dir, 'missing.json')).code).toBe(2);
    expect(cribra('verify', write('garbage.json', '{"cells": [')).stderr).toMatch(/^cribra verify: not JSON/);
    expect(cribra('verify', write('other.json', { hello: 1 })).stderr).toMatch(/not a lock record/);
    expect(cribra('verify').code).toBe(2);
  });

  it('reads a record from an http URL', async () => {
    const body = `${canonicalJson(makeRecord())}\n`;
    const server = createServer((req, res) => {
      if (req.url === '/records/r1.json') res.writeHead(200, { 'content-type': 'application/json' }).end(body);
      else res.writeHead(404).end('{}');
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const { port } = server.address() as AddressInfo;
    try {
      let out = '';
      let err = '';
      const ok = await verifyCommand([`http://127.0.0.1:${port}/records/r1.json`, '--workers', '1'], (s) => (out += s), (s) => (err += s));
      expect(err).toBe('');
      expect(ok).toBe(0);
      expect(out).toContain('cells: 2 same');
      const missing = await verifyCommand([`http://127.0.0.1:${port}/records/nope.json`], () => undefined, (s) => (err += s));
      expect(missing).toBe(2);
      expect(err).toContain('HTTP 404');
    } finally {
      server.close();
    }
  });
});
