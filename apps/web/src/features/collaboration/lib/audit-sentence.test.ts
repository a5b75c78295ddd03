import type { AuditEventView } from '@cribra/contracts';
import { describe, expect, it } from 'vitest';
import { auditSentence } from './audit-sentence';

const ada = { id: 'u-ada', displayName: 'Ada Grey' };
const names = new Map([['u-bo', 'Bo Lind']]);
const say = (action: string, details: Record<string, unknown> = {}, actor: AuditEventView['actor'] = ada) =>
  auditSentence({ id: 'e', at: '2025-01-01T00:00:00Z', actor, notebookId: 'n1', action, details }, names);

describe('auditSentence', () => {
  it('reads the recorded kinds as sentences', () => {
    expect(say('notebook.update', { fields: ['title', 'tags', 'requiredSignoffs'] })).toBe('Ada Grey changed the title, tags and required sign-offs');
    expect(say('member.role', { userId: 'u-bo', from: 'viewer', to: 'reviewer' })).toBe('Ada Grey changed the role of Bo Lind from viewer to reviewer');
    expect(say('member.remove', { userId: 'u-gone', role: 'editor' })).toBe('Ada Grey removed a former member (editor) from the notebook');
    expect(say('invitation.create', { email: 'bo@example.org', role: 'viewer' })).toBe('Ada Grey invited bo@example.org as viewer');
    expect(say('invitation.resend', { email: 'bo@example.org' })).toBe('Ada Grey sent the invitation to bo@example.org again');
    expect(say('notebook.lock', { revisionDigest: 'f'.repeat(64) })).toBe('Ada Grey locked the notebook at the revision with digest ffffffffffff');
    expect(say('lock.check', { verificationId: 'v1' })).toBe('Ada Grey re-checked the lock record');
    expect(say('export.lock_markdown')).toBe('Ada Grey exported the lock record as Markdown');
    expect(say('export.latex', { revision: 4 })).toBe('Ada Grey exported the notebook as LaTeX');
    expect(say('upload.create', { name: 'zeros.csv' })).toBe('Ada Grey uploaded the file zeros.csv');
    expect(say('cell.update', { cellId: 'c1', revision: 3, fields: ['source'] })).toBe('Ada Grey edited a cell (its revision 3)');
    expect(say('cell.update', { cellId: 'c1', revision: 4, fields: ['kind'] })).toBe('Ada Grey changed the kind of a cell (its revision 4)');
    expect(say('cell.update', { cellId: 'c1', revision: 5, fields: ['source', 'kind'] })).toBe('Ada Grey edited a cell and changed its kind (its revision 5)');
    expect(say('review.signoff', { revisionDigest: 'a'.repeat(64), notebookRevision: 7 })).toBe('Ada Grey signed off revision 7 with digest aaaaaaaaaaaa');
    expect(say('review.signoff', { revisionDigest: 'a'.repeat(64) })).toBe('Ada Grey signed off the revision with digest aaaaaaaaaaaa');
  });

  it('keeps an unknown action visible', () => {
    expect(say('cell.archive')).toBe('Ada Grey: cell.archive');
    expect(say('cell.archive', {}, null)).toBe('The server: cell.archive');
  });
});
