// The permission matrix, cell by cell: every notebook action (the policy's own table, so a new
// action without a probe fails) × owner, editor, reviewer, viewer, outsider, admin, through HTTP.
// Then every action again on a locked notebook. docs/permissions.md must show the same table.
import type { INestApplication } from '@nestjs/common';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ADMIN_EXCLUDED, CHANGES_CONTENT, MATRIX, NotebookPolicyService, type NotebookAction } from '../src/members/notebook-policy.service';
import { allowed, bare, created, fixture, people, PROBES, setUpPeople, WHO, type Fixture } from './helpers/permission-probes';
import { deleteNotebooks } from './helpers/review-fixtures';
import { createTestApp } from './helpers/test-app';

let app: INestApplication;
let shared: Fixture;

beforeAll(async () => {
  app = await createTestApp();
  await setUpPeople(app);
  shared = await fixture();
});

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

const ACTIONS = Object.keys(MATRIX) as NotebookAction[];

describe('the policy table', () => {
  it('has a probe for every action', () => {
    expect(Object.keys(PROBES).sort()).toEqual([...ACTIONS].sort());
  });

  it('is the table docs/permissions.md shows', () => {
    const doc = readFileSync(join(__dirname, '../../../docs/permissions.md'), 'utf8');
    const block = doc.slice(doc.indexOf('<!-- permission-matrix:start -->'), doc.indexOf('<!-- permission-matrix:end -->'));
    const rows = block.split('\n').filter((l) => l.startsWith('| `'));
    const shown = rows.map((l) => {
      const cells = l.split('|').map((c) => c.trim());
      return { action: cells[1].replace(/`/g, ''), marks: cells.slice(3, 9), locked: cells[9] };
    });
    expect(shown.map((r) => r.action)).toEqual(ACTIONS);
    for (const r of shown) {
      const action = r.action as NotebookAction;
      expect([action, r.marks]).toEqual([action, WHO.map((who) => (allowed(action, who) ? '✓' : '—'))]);
      expect([action, r.locked.includes('409')]).toEqual([action, CHANGES_CONTENT.has(action)]);
    }
  });

  it('decides every cell as the table says (pure decision)', () => {
    const policy = app.get(NotebookPolicyService);
    for (const action of ACTIONS) {
      for (const who of WHO) {
        const actor = { id: 'x', siteRole: who === 'admin' ? ('admin' as const) : ('member' as const) };
        const role = who === 'admin' || who === 'outsider' ? null : who;
        expect([action, who, policy.can(actor, action, { status: 'draft' }, role)]).toEqual([action, who, allowed(action, who)]);
        if (CHANGES_CONTENT.has(action)) expect(policy.can(actor, action, { status: 'locked' }, role)).toBe(false);
      }
    }
  });
});

describe.each(ACTIONS)('%s', (action) => {
  it.each(WHO)('as %s', async (who) => {
    const probe = PROBES[action];
    const f = probe.fresh ? await bare() : shared;
    const res = await probe.send(people[who].client, f, who);
    const expected = allowed(action, who) ? probe.ok : [403];
    if (!expected.includes(res.status)) {
      throw new Error(`${action} as ${who}: expected ${expected.join(' or ')}, got ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`);
    }
  });
});

describe('on a locked notebook', () => {
  let locked: Fixture;
  beforeAll(async () => {
    locked = await fixture({ locked: true });
  });

  // Every content-changing action is refused (409 for anyone with access, 403 for others);
  // reading, the lock record, checks and duplication stay as the table says.
  // Publishing: the first allowed person publishes (201), the next is told it already is (409).
  const LOCKED_OK: Partial<Record<NotebookAction, number[]>> = {
    'lock.read': [200],
    'lock.check': [202],
    'record.publish': [201, 409],
    'record.read': [200, 404],
  };

  describe.each(ACTIONS)('%s', (action) => {
    it.each(WHO)('as %s', async (who) => {
      const probe = PROBES[action];
      const res = await probe.send(people[who].client, locked, who);
      let expected: number[];
      const hasAccess = who !== 'outsider' && !(who === 'admin' && ADMIN_EXCLUDED.has(action));
      if (CHANGES_CONTENT.has(action)) expected = hasAccess ? [409] : [403];
      else if (!allowed(action, who)) expected = [403];
      else expected = LOCKED_OK[action] ?? probe.ok;
      if (!expected.includes(res.status)) {
        throw new Error(`locked ${action} as ${who}: expected ${expected.join(' or ')}, got ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`);
      }
      // A refused change says why; publishing a record twice is the one other 409 on a locked notebook.
      if (res.status === 409 && action === 'record.publish') expect(res.body.details.reason).toBe('already_published');
      else if (res.status === 409) expect(res.body.details).toEqual({ reason: 'notebook_locked', notebookId: locked.id });
    });
  });
});
