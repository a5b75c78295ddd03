// Review through the API: invitation by e-mail (link followed), review request, re-verify on the
// runner, sign-off bound to the revision digest, voiding on change (with the reviewer's e-mail),
// tampered recorded outputs reported as 'differs'.
import type { INestApplication } from '@nestjs/common';
import { DataSource } from 'typeorm';
import { INVITATION_PATH, type ReviewStateView, type ReviewView, type VerificationView } from '@cribra/contracts';
import { revisionDigestOf, type DigestCell } from '../src/reviews/revision-digest';
import { waitForMail } from './helpers/mailbox';
import {
  createNotebook,
  deleteNotebooks,
  expectStatus,
  linkInMail,
  memberWithRole,
  runAll,
  sleep,
  verifyAndSignOff,
  waitVerification,
} from './helpers/review-fixtures';
import { Client, createTestApp, newMember, PASSWORD, uniqueEmail } from './helpers/test-app';

let app: INestApplication;
let db: DataSource;
const created: string[] = [];

beforeAll(async () => {
  app = await createTestApp();
  db = app.get(DataSource);
});

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

describe('revision digest', () => {
  const cell = (over: Partial<DigestCell> = {}): DigestCell => ({
    id: '00000000-0000-4000-8000-000000000001',
    kind: 'query',
    position: 0,
    source: 'show 1',
    outputDigest: 'a'.repeat(64),
    runId: null,
    engineVersion: null,
    languageVersion: null,
    ...over,
  });

  it('is sha-256 over version tag and [id, kind, position, source, outputDigest] in order', () => {
    const { createHash } = require('node:crypto') as typeof import('node:crypto');
    const c = cell();
    const expected = createHash('sha256')
      .update(`cribra-revision-v1\n${JSON.stringify([[c.id, c.kind, c.position, c.source, c.outputDigest]])}`)
      .digest('hex');
    expect(revisionDigestOf([c])).toBe(expected);
  });

  it('changes with each bound field and ignores run ids and versions', () => {
    const base = revisionDigestOf([cell()]);
    for (const over of [{ source: 'show 2' }, { kind: 'claim' }, { position: 1 }, { outputDigest: null }, { id: '00000000-0000-4000-8000-000000000002' }]) {
      expect(revisionDigestOf([cell(over)])).not.toBe(base);
    }
    expect(revisionDigestOf([cell({ runId: 'x', engineVersion: '9', languageVersion: '9' })])).toBe(base);
  });
});

describe('the review flow', () => {
  it('invites a reviewer by e-mail, re-verifies, signs off, voids on change and re-signs', async () => {
    const { client: owner, user: ownerUser } = await newMember(app, 'owner');
    const nb = await createNotebook(owner, 'Twin counts up to 10^4');
    created.push(nb.id);
    await runAll(owner, nb.id);

    // Invitation by e-mail, link followed, account created with the token.
    const reviewerEmail = uniqueEmail('reviewer');
    const inv = await owner.call('post', `/api/notebooks/${nb.id}/invitations`, { email: reviewerEmail, role: 'reviewer' });
    expectStatus(inv, 201);
    expect(inv.body).toMatchObject({ status: 'pending', delivery: 'sent', role: 'reviewer' });
    const link = await linkInMail(reviewerEmail, `${process.env.PUBLIC_URL}${INVITATION_PATH}/`);
    const token = link.split('/').pop()!;
    const reviewer = new Client(app);
    const preview = await reviewer.call('get', `/api/invitations/token/${token}`);
    expectStatus(preview, 200);
    expect(preview.body).toMatchObject({ notebookId: nb.id, role: 'reviewer', email: reviewerEmail, accountExists: false });
    const signUp = await reviewer.call('post', '/api/auth/signup', {
      email: reviewerEmail,
      password: PASSWORD,
      displayName: 'Rita Reviewer',
      invitationToken: token,
    });
    expectStatus(signUp, 201);
    const members = await owner.call('get', `/api/notebooks/${nb.id}/members`);
    expect(members.body.find((m: { email: string }) => m.email === reviewerEmail)?.role).toBe('reviewer');

    // A reviewer cannot sign off a draft.
    const draftState: ReviewStateView = (await reviewer.call('get', `/api/notebooks/${nb.id}/review`)).body;
    expect(draftState.status).toBe('draft');
    expect(draftState.canLock).toBe(false);

    // Owner asks for review; the reviewer is told.
    const req = await owner.call('post', `/api/notebooks/${nb.id}/review/request`, { message: 'Please check the counts' });
    expectStatus(req, 200);
    expect(req.body.status).toBe('in_review');
    const askMail = await waitForMail(reviewerEmail, 2);
    expect(askMail.subject).toContain('Review requested');
    expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/review/request`, {}), 409);

    // Re-verify on the runner: every query cell 'same', the note skipped.
    const { verification, reviewId } = await verifyAndSignOff(reviewer, nb.id);
    expect(verification.allSame).toBe(true);
    expect(verification.counts).toMatchObject({ same: 2, skipped: 1, differs: 0, failed: 0, pending: 0 });
    const runs = await owner.call('get', `/api/notebooks/${nb.id}/runs?pageSize=50`);
    expect(runs.body.items.filter((r: { purpose: string }) => r.purpose === 'reverify')).toHaveLength(2);
    // The cells still show their recorded runs, not the re-verify runs.
    const shown = await owner.call('get', `/api/notebooks/${nb.id}`);
    const queryCells = shown.body.cells.filter((c: { kind: string }) => c.kind !== 'note');
    expect(queryCells).toHaveLength(2);
    for (const cell of queryCells) expect(cell.latestRun.purpose).toBe('run');

    // Re-verify runs did not change the digest; the sign-off is valid and the notebook may be locked.
    let state: ReviewStateView = (await owner.call('get', `/api/notebooks/${nb.id}/review`)).body;
    expect(state.revisionDigest).toBe(verification.revisionDigest);
    expect(state.validSignoffs.map((s) => s.id)).toEqual([reviewId]);
    expect(state.canLock).toBe(true);
    expectStatus(await reviewer.call('post', `/api/notebooks/${nb.id}/reviews`, {
      decision: 'signoff', comment: 'again', revisionDigest: state.revisionDigest, verificationId: verification.id,
    }), 409);

    // An edit voids the sign-off (the watcher reacts to the revision bump), mails the reviewer.
    const cell = nb.cells[0];
    expectStatus(await owner.call('put', `/api/cells/${cell.id}`, { revision: cell.revision, source: 'show 2^31 - 1 as "M31"' }), 200);
    const voidMail = await waitForMail(reviewerEmail, 3, 15_000);
    expect(voidMail.subject).toContain('no longer holds');
    const reviews: ReviewView[] = (await owner.call('get', `/api/notebooks/${nb.id}/reviews`)).body;
    expect(reviews.find((r) => r.id === reviewId)).toMatchObject({ valid: false });
    expect(reviews.find((r) => r.id === reviewId)?.voidedAt).not.toBeNull();
    state = (await owner.call('get', `/api/notebooks/${nb.id}/review`)).body;
    expect(state.status).toBe('in_review');
    expect(state.validSignoffs).toHaveLength(0);
    expect(state.revisionDigest).not.toBe(verification.revisionDigest);
    expect(state.lockBlockers.join(' ')).toMatch(/sign-off/);

    // A sign-off naming the old digest is stale.
    const stale = await reviewer.call('post', `/api/notebooks/${nb.id}/reviews`, {
      decision: 'signoff', comment: 'old', revisionDigest: verification.revisionDigest, verificationId: verification.id,
    });
    expectStatus(stale, 409);
    expect(stale.body.details).toMatchObject({ reason: 'stale_digest', revisionDigest: state.revisionDigest });

    // Re-verify before re-running: the edited cell has no recorded output → differs; no sign-off.
    const v2 = await reviewer.call('post', `/api/notebooks/${nb.id}/verifications`);
    const v2done = await waitVerification(reviewer, v2.body.id);
    expect(v2done.allSame).toBe(false);
    expect(v2done.cells.find((c) => c.cellId === cell.id)).toMatchObject({ status: 'differs', recordedDigest: null });
    const refused = await reviewer.call('post', `/api/notebooks/${nb.id}/reviews`, {
      decision: 'signoff', comment: 'x', revisionDigest: v2done.revisionDigest, verificationId: v2done.id,
    });
    expectStatus(refused, 409);

    // Run, re-verify, sign off again; audit shows the trail to the owner.
    await runAll(owner, nb.id);
    await verifyAndSignOff(reviewer, nb.id);
    state = (await owner.call('get', `/api/notebooks/${nb.id}/review`)).body;
    expect(state.canLock).toBe(true);
    const audit = await owner.call('get', `/api/notebooks/${nb.id}/audit`);
    const actions = audit.body.map((e: { action: string }) => e.action);
    for (const a of ['invitation.create', 'invitation.accept', 'member.join', 'review.request', 'review.signoff', 'review.signoff_void']) {
      expect(actions).toContain(a);
    }
    // The owner asked for review: the audit names them as the actor.
    const request = audit.body.find((e: { action: string }) => e.action === 'review.request') as { actor: { id: string } | null };
    expect(request.actor?.id).toBe(ownerUser.id);
    // A sign-off names the notebook revision it signed beside the digest.
    const signoff = audit.body.find((e: { action: string }) => e.action === 'review.signoff') as { details: { notebookRevision: unknown; revisionDigest: unknown } };
    expect(signoff.details.notebookRevision).toBe((await owner.call('get', `/api/notebooks/${nb.id}`)).body.revision);
    expect(typeof signoff.details.revisionDigest).toBe('string');
  });

  it('asking for changes returns the notebook to draft; a sign-off needs a finished re-verify', async () => {
    const { client: owner } = await newMember(app, 'owner');
    const nb = await createNotebook(owner, 'Changes requested');
    created.push(nb.id);
    await runAll(owner, nb.id);
    const { client: reviewer } = await memberWithRole(app, owner, nb.id, 'reviewer');
    expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/review/request`, {}), 200);
    const state: ReviewStateView = (await reviewer.call('get', `/api/notebooks/${nb.id}/review`)).body;
    const noVerification = await reviewer.call('post', `/api/notebooks/${nb.id}/reviews`, {
      decision: 'signoff', comment: 'looks fine', revisionDigest: state.revisionDigest,
    });
    expectStatus(noVerification, 400);
    expect(noVerification.body.details[0].field).toBe('verificationId');
    // The owner's re-verify does not stand for the reviewer's own.
    const ownerCheck = await owner.call('post', `/api/notebooks/${nb.id}/verifications`);
    const ownerDone = await waitVerification(owner, ownerCheck.body.id);
    expect(ownerDone.allSame).toBe(true);
    const notMine = await reviewer.call('post', `/api/notebooks/${nb.id}/reviews`, {
      decision: 'signoff', comment: 'fine', revisionDigest: state.revisionDigest, verificationId: ownerDone.id,
    });
    expectStatus(notMine, 400);
    expect(notMine.body.message).toMatch(/yourself/);
    const bad = await reviewer.call('post', `/api/notebooks/${nb.id}/reviews`, { decision: 'maybe', comment: '', revisionDigest: 'x' });
    expectStatus(bad, 400);
    expect(bad.body.details.map((d: { field: string }) => d.field).sort()).toEqual(['comment', 'decision', 'revisionDigest']);
    const changes = await reviewer.call('post', `/api/notebooks/${nb.id}/reviews`, {
      decision: 'changes_requested', comment: 'Please state the range checked in the claim.', revisionDigest: state.revisionDigest,
    });
    expectStatus(changes, 201);
    expect(changes.body).toMatchObject({ decision: 'changes_requested', valid: false });
    expect((await owner.call('get', `/api/notebooks/${nb.id}`)).body.status).toBe('draft');
  });
});

describe('the sign-off precondition', () => {
  it("refuses a sign-off on the reviewer's own clean re-verify once the revision has moved on, and takes one of the current revision", async () => {
    const { client: owner } = await newMember(app, 'owner');
    const nb = await createNotebook(owner, 'Sign-off precondition');
    created.push(nb.id);
    await runAll(owner, nb.id);
    const { client: reviewer } = await memberWithRole(app, owner, nb.id, 'reviewer');
    expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/review/request`, {}), 200);
    const first = await reviewer.call('post', `/api/notebooks/${nb.id}/verifications`);
    const old = await waitVerification(reviewer, first.body.id);
    expect(old.allSame).toBe(true);

    // The owner edits the note: a new revision (and digest) that the reviewer has not re-run.
    const note = (await owner.call('get', `/api/notebooks/${nb.id}`)).body.cells.find((c: { kind: string }) => c.kind === 'note');
    expectStatus(await owner.call('put', `/api/cells/${note.id}`, { revision: note.revision, source: 'A note: $p_n$, edited' }), 200);
    if ((await owner.call('get', `/api/notebooks/${nb.id}`)).body.status !== 'in_review') {
      expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/review/request`, {}), 200);
    }
    const state: ReviewStateView = (await reviewer.call('get', `/api/notebooks/${nb.id}/review`)).body;
    expect(state.revisionDigest).not.toBe(old.revisionDigest);
    const stale = await reviewer.call('post', `/api/notebooks/${nb.id}/reviews`, {
      decision: 'signoff', comment: 'Re-ran it earlier.', revisionDigest: state.revisionDigest, verificationId: old.id,
    });
    expectStatus(stale, 400);
    expect(stale.body.details[0]).toEqual({ field: 'verificationId', messages: ['not a re-verify of this revision'] });

    const again = await reviewer.call('post', `/api/notebooks/${nb.id}/verifications`);
    const current = await waitVerification(reviewer, again.body.id);
    const ok = await reviewer.call('post', `/api/notebooks/${nb.id}/reviews`, {
      decision: 'signoff', comment: 'Re-ran this revision.', revisionDigest: state.revisionDigest, verificationId: current.id,
    });
    expectStatus(ok, 201);
    expect(ok.body).toMatchObject({ decision: 'signoff', valid: true });
  });
});

describe('re-verify against tampered records', () => {
  let owner: Client;
  let reviewer: Client;
  let nbId: string;

  beforeAll(async () => {
    ({ client: owner } = await newMember(app, 'owner'));
    const nb = await createNotebook(owner, 'Tamper target');
    nbId = nb.id;
    created.push(nb.id);
    await runAll(owner, nb.id);
    ({ client: reviewer } = await memberWithRole(app, owner, nb.id, 'reviewer'));
    expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/review/request`, {}), 200);
  });

  async function reverify(): Promise<VerificationView> {
    const res = await reviewer.call('post', `/api/notebooks/${nbId}/verifications`);
    expectStatus(res, 202);
    return waitVerification(reviewer, res.body.id);
  }

  it('reports differs, with both outputs, when a stored output and its digest were replaced in SQL', async () => {
    const nb = (await owner.call('get', `/api/notebooks/${nbId}`)).body;
    const target = nb.cells[1];
    const forged = [{ kind: 'value', label: null, value: { t: 'int', v: '43' }, text: '43' }];
    await db.query(`UPDATE runs SET outputs = $2, output_digest = $3 WHERE id = $1`, [target.latestRun.id, JSON.stringify(forged), 'f'.repeat(64)]);
    const v = await reverify();
    const cell = v.cells.find((c) => c.cellId === target.id)!;
    expect(cell.status).toBe('differs');
    expect(cell.note).toBe('outputs differ');
    expect(cell.recordedDigest).toBe('f'.repeat(64));
    expect(cell.recordedOutputs).toEqual(forged);
    expect(cell.newOutputs?.[0]).toMatchObject({ kind: 'value', text: '42' });
    expect(v.cells.find((c) => c.cellId === nb.cells[0].id)?.status).toBe('same');
    expect(v.allSame).toBe(false);
  });

  it('reports differs when only the stored outputs were replaced (digest left as recorded)', async () => {
    await runAll(owner, nbId);
    const nb = (await owner.call('get', `/api/notebooks/${nbId}`)).body;
    const target = nb.cells[0];
    await db.query(`UPDATE runs SET outputs = $2 WHERE id = $1`, [
      target.latestRun.id,
      JSON.stringify([{ kind: 'value', label: 'M61', value: { t: 'int', v: '7' }, text: '7' }]),
    ]);
    const v = await reverify();
    const cell = v.cells.find((c) => c.cellId === target.id)!;
    expect(cell.status).toBe('differs');
    expect(cell.note).toBe('the recorded outputs do not match their recorded digest');
    expect(cell.newDigest).toBe(cell.recordedDigest);
  });
});

afterAll(async () => {
  await sleep(0);
});
