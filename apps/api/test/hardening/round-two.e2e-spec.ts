// Hardening, round two (issue 19): the small findings — paging parameters out of range, CSV
// exports that a spreadsheet would execute, and tuple uploads with a repeated value.
import type { INestApplication } from '@nestjs/common';
import { addCell, createNotebook, person, type Person } from '../helpers/notebooks';
import { deleteNotebooks } from '../helpers/review-fixtures';
import { createTestApp } from '../helpers/test-app';

let app: INestApplication;
let owner: Person;
const created: string[] = [];

beforeAll(async () => {
  app = await createTestApp();
  owner = await person(app, 'r2-owner');
});

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

describe('paging parameters', () => {
  it('answers 400 naming the field for a page past the limit, on every paged list (was 500 "bigint out of range")', async () => {
    const nb = await createNotebook(owner);
    created.push(nb.id);
    const cell = await addCell(owner, nb.id, 'show 1');
    for (const path of ['/api/notebooks', '/api/ledger/blocks', `/api/notebooks/${nb.id}/runs`, `/api/cells/${cell.id}/runs`]) {
      for (const page of ['1e20', '99999999999', '1000001']) {
        const res = await owner.client.call('get', `${path}?page=${page}`);
        if (res.status !== 400) throw new Error(`${path}?page=${page}: expected 400, got ${res.status} ${JSON.stringify(res.body)}`);
        expect(res.body.details).toEqual([expect.objectContaining({ field: 'page' })]);
      }
      const big = await owner.client.call('get', `${path}?pageSize=1e20`);
      expect(big.status).toBe(400);
    }
    expect((await owner.client.call('get', '/api/notebooks?page=1000000')).status).toBe(200);
  });
});
