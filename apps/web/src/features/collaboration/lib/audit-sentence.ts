import type { AuditEventView } from '@cribra/contracts';

/** Display names of the people an event may name by id (the notebook's members). */
export type NameLookup = ReadonlyMap<string, string>;

const str = (v: unknown): string | null => (typeof v === 'string' && v.trim() !== '' ? v : null);
const shortDigest = (v: unknown): string | null => str(v)?.slice(0, 12) ?? null;

const FIELD_LABEL: Record<string, string> = {
  title: 'title',
  summary: 'summary',
  tags: 'tags',
  requiredSignoffs: 'required sign-offs',
};

const FORMAT_LABEL: Record<string, string> = { markdown: 'Markdown', latex: 'LaTeX', json: 'JSON' };

/** "a", "a and b", "a, b and c". */
function listWords(words: string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

/**
 * One audit event as a plain sentence, e.g. "Ada Grey signed off the revision with digest 3f9a1c2e7b0d".
 * Unknown actions still read as "<who>: <action>", so a new kind of event is never hidden.
 */
export function auditSentence(e: AuditEventView, names: NameLookup = new Map()): string {
  const d = e.details ?? {};
  const who = e.actor ? e.actor.displayName || 'Someone' : 'The server';
  const person = (id: unknown): string => {
    const key = str(id);
    return (key && names.get(key)) || 'a former member';
  };
  const role = str(d.role);
  const email = str(d.email);
  const digest = shortDigest(d.revisionDigest);

  switch (e.action) {
    case 'notebook.create':
      return str(d.duplicateOf) ? `${who} created the notebook as a copy of another one` : `${who} created the notebook`;
    case 'notebook.update': {
      const fields = Array.isArray(d.fields) ? d.fields.filter((f): f is string => typeof f === 'string').map((f) => FIELD_LABEL[f] ?? f) : [];
      return fields.length ? `${who} changed the ${listWords(fields)}` : `${who} changed the notebook's settings`;
    }
    case 'notebook.delete':
      return `${who} deleted the notebook`;
    case 'notebook.duplicate':
      return `${who} made a copy of the notebook`;
    case 'notebook.lock':
      return digest ? `${who} locked the notebook at the revision with digest ${digest}` : `${who} locked the notebook`;
    case 'cell.create':
      return str(d.kind) ? `${who} added a ${d.kind as string} cell` : `${who} added a cell`;
    case 'cell.update': {
      const fields = Array.isArray(d.fields) ? d.fields : [];
      const revision = typeof d.revision === 'number' ? ` (its revision ${d.revision})` : '';
      if (fields.includes('kind') && !fields.includes('source')) return `${who} changed the kind of a cell${revision}`;
      return `${who} edited a cell${fields.includes('kind') ? ' and changed its kind' : ''}${revision}`;
    }
    case 'cell.delete':
      return `${who} deleted a cell`;
    case 'cell.reorder':
      return `${who} changed the order of the cells`;
    case 'run.cancel':
      return `${who} cancelled a run`;
    case 'upload.create':
      return str(d.name) ? `${who} uploaded the file ${d.name as string}` : `${who} uploaded a file`;
    case 'upload.delete':
      return str(d.name) ? `${who} deleted the file ${d.name as string}` : `${who} deleted a file`;
    case 'member.add':
      return `${who} added ${person(d.userId)}${role ? ` as ${role}` : ''}`;
    case 'member.join':
      return `${who} joined the notebook${role ? ` as ${role}` : ''}`;
    case 'member.role': {
      const change = str(d.from) && str(d.to) ? ` from ${d.from as string} to ${d.to as string}` : '';
      return e.actor && str(d.userId) === e.actor.id
        ? `${who}'s role changed${change} through an invitation`
        : `${who} changed the role of ${person(d.userId)}${change}`;
    }
    case 'member.remove':
      return `${who} removed ${person(d.userId)}${role ? ` (${role})` : ''} from the notebook`;
    case 'invitation.create':
      return `${who} invited ${email ?? 'someone'}${role ? ` as ${role}` : ''}`;
    case 'invitation.resend':
      return email ? `${who} sent the invitation to ${email} again` : `${who} sent an invitation again`;
    case 'invitation.revoke':
      return email ? `${who} withdrew the invitation to ${email}` : `${who} withdrew an invitation`;
    case 'invitation.accept':
      return `${who} accepted the invitation${role ? ` as ${role}` : ''}`;
    case 'review.request':
      return `${who} asked for review`;
    case 'review.signoff': {
      const revision = typeof d.notebookRevision === 'number' ? `revision ${d.notebookRevision}` : 'the revision';
      return digest ? `${who} signed off ${revision} with digest ${digest}` : `${who} signed off`;
    }
    case 'review.changes_requested':
      return `${who} asked for changes`;
    case 'review.signoff_void':
      return `The sign-off by ${person(d.reviewerId)} no longer counts: the notebook changed${digest ? ` (now at digest ${digest})` : ''}`;
    case 'thread.resolve':
      return `${who} resolved a comment thread`;
    case 'thread.reopen':
      return `${who} reopened a comment thread`;
    case 'lock.check':
      return `${who} re-checked the lock record`;
    case 'export.lock_json':
    case 'export.lock_markdown':
      return `${who} exported the lock record as ${FORMAT_LABEL[e.action.slice('export.lock_'.length)]}`;
    default: {
      if (e.action.startsWith('export.')) {
        const format = e.action.slice('export.'.length);
        return `${who} exported the notebook as ${FORMAT_LABEL[format] ?? format}`;
      }
      return `${who}: ${e.action}`;
    }
  }
}
