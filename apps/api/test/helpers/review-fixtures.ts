// Fixtures shared by the review, lock, invitation, comment and permission tests: notebooks with
// cells, waiting for runs and re-verifies (executed by the runner the launcher starts), e-mailed
// links, and teardown of locked notebooks.
import type { INestApplication } from '@nestjs/common';
import { asOwner } from './sql-as';
import type { NotebookView, RunView, VerificationView } from '@cribra/contracts';
import { Client, newMember } from './test-app';
import { waitForMail } from './mailbox';

export const sleep = (ms: number): Promise<void> => new Promise((r) => setTimeout(r, ms));

/** Light Sift cells (fast on the runner); their outputs are exact integers. */
export const LIGHT_CELLS = ['show 2^61 - 1 as "M61"', 'show 6 * 7'];

export function expectStatus(res: { status: number; body: unknown }, status: number): void {
  if (res.status !== status) throw new Error(`expected HTTP ${status}, got ${res.status}: ${JSON.stringify(res.body)}`);
}

export async function createNotebook(owner: Client, title = 'Review fixture', cells = LIGHT_CELLS): Promise<NotebookView> {
  const res = await owner.call('post', '/api/notebooks', { title, summary: 'fixture', tags: ['fixture'] });
  expectStatus(res, 201);
  for (const source of cells) expectStatus(await owner.call('post', `/api/notebooks/${res.body.id}/cells`, { kind: 'query', source }), 201);
  expectStatus(await owner.call('post', `/api/notebooks/${res.body.id}/cells`, { kind: 'note', source: 'A note: $p_n$' }), 201);
  return (await owner.call('get', `/api/notebooks/${res.body.id}`)).body;
}

/** Polls a run until it is final. */
export async function waitRun(client: Client, runId: string, timeoutMs = 60_000): Promise<RunView> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const res = await client.call('get', `/api/runs/${runId}`);
    if (['succeeded', 'failed', 'cancelled'].includes(res.body.status)) return res.body;
    await sleep(150);
  }
  throw new Error(`run ${runId} did not finish within ${timeoutMs} ms (is a runner up?)`);
}

/** Runs every query/claim cell and waits for all of them to succeed. */
export async function runAll(client: Client, notebookId: string): Promise<RunView[]> {
  const res = await client.call('post', `/api/notebooks/${notebookId}/runs`);
  expectStatus(res, 202);
  const done: RunView[] = [];
  for (const r of res.body.runs as RunView[]) done.push(await waitRun(client, r.id));
  for (const r of done) if (r.status !== 'succeeded') throw new Error(`run failed: ${JSON.stringify(r.error)}`);
  return done;
}

export async function waitVerification(client: Client, id: string, timeoutMs = 60_000): Promise<VerificationView> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const res = await client.call('get', `/api/verifications/${id}`);
    expectStatus(res, 200);
    if (res.body.status === 'done') return res.body;
    await sleep(150);
  }
  throw new Error(`verification ${id} did not finish within ${timeoutMs} ms`);
}

/** A new member added to the notebook with `role` (by the owner, through the API). */
export async function memberWithRole(
  app: INestApplication,
  owner: Client,
  notebookId: string,
  role: 'editor' | 'reviewer' | 'viewer',
): Promise<Awaited<ReturnType<typeof newMember>>> {
  const m = await newMember(app, role);
  expectStatus(await owner.call('post', `/api/notebooks/${notebookId}/members`, { email: m.email, role }), 201);
  return m;
}

/** Re-verifies as `reviewer` and signs off the current revision. */
export async function verifyAndSignOff(reviewer: Client, notebookId: string): Promise<{ verification: VerificationView; reviewId: string }> {
  const started = await reviewer.call('post', `/api/notebooks/${notebookId}/verifications`);
  expectStatus(started, 202);
  const verification = await waitVerification(reviewer, started.body.id);
  const res = await reviewer.call('post', `/api/notebooks/${notebookId}/reviews`, {
    decision: 'signoff',
    comment: 'Re-ran every cell; all outputs **reproduce**.',
    revisionDigest: verification.revisionDigest,
    verificationId: verification.id,
  });
  expectStatus(res, 201);
  return { verification, reviewId: res.body.id };
}

/** The link in an e-mail (the n-th one to `address`) that starts with `prefix`. */
export async function linkInMail(address: string, prefix: string, count = 1): Promise<string> {
  const mail = await waitForMail(address, count);
  const escaped = prefix.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  const m = new RegExp(`${escaped}\\S+`).exec(mail.text ?? '');
  if (!m) throw new Error(`no link starting with ${prefix} in: ${mail.text}`);
  return m[0];
}

/**
 * Deletes notebooks, locked ones included (the documented maintenance escape of the lock trigger,
 * honoured only for the tables' owner: the app's own role cannot use it).
 */
export async function deleteNotebooks(_app: INestApplication, ids: string[]): Promise<void> {
  if (!ids.length) return;
  await asOwner(`DELETE FROM notebooks WHERE id = ANY($1::uuid[])`, [ids]);
}
