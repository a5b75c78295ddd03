import type { INestApplication } from '@nestjs/common';
import type { CellView, MemberRole, NotebookView } from '@cribra/contracts';
import { Client, newMember } from './test-app';

export interface Person {
  client: Client;
  id: string;
  email: string;
}

export async function person(app: INestApplication, tag: string): Promise<Person> {
  const m = await newMember(app, tag);
  return { client: m.client, id: m.user.id, email: m.email };
}

export async function createNotebook(owner: Person, body: Record<string, unknown> = {}): Promise<NotebookView> {
  const res = await owner.client.call('post', '/api/notebooks', { title: 'Gap patterns at level 13', ...body });
  if (res.status !== 201) throw new Error(`create notebook: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

export async function addMember(owner: Person, notebookId: string, who: Person, role: Exclude<MemberRole, 'owner'>): Promise<void> {
  const res = await owner.client.call('post', `/api/notebooks/${notebookId}/members`, { email: who.email, role });
  if (res.status !== 201) throw new Error(`add member: ${res.status} ${JSON.stringify(res.body)}`);
}

export async function addCell(owner: Person, notebookId: string, source: string, kind = 'query'): Promise<CellView> {
  const res = await owner.client.call('post', `/api/notebooks/${notebookId}/cells`, { kind, source });
  if (res.status !== 201) throw new Error(`add cell: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

/** A UUID that names nothing. */
export const NO_SUCH_ID = '00000000-0000-4000-8000-000000000000';
