import type { UserRef } from '@cribra/contracts';

// Mentions are written "@Display Name" in the comment text; the API gets the user ids beside it.

/** The "@letters…" being typed just before the caret: where its "@" is and what follows it. */
export interface MentionQuery {
  start: number;
  query: string;
}

// "@" at the start or after a space or an opening bracket/quote (not inside an e-mail address),
// then a letter, then name characters with at most one space (first and last name).
const TYPED = /(?:^|[\s([{"'])@(\p{L}[\p{L}\p{M}'.-]*(?: [\p{L}\p{M}'.-]*)?)$/u;

export function mentionQueryAt(text: string, caret: number): MentionQuery | null {
  const m = TYPED.exec(text.slice(0, caret));
  if (!m) return null;
  return { start: caret - m[1].length - 1, query: m[1] };
}

/** Members whose name, or one of its words, begins with the query (any case), in the list's order. */
export function matchMembers(members: UserRef[], query: string, limit = 8): UserRef[] {
  const q = query.trim().toLocaleLowerCase();
  if (!q) return [];
  return members
    .filter((m) => {
      const name = m.displayName.toLocaleLowerCase();
      return name.startsWith(q) || name.split(/\s+/).some((w) => w.startsWith(q));
    })
    .slice(0, limit);
}

const escapeRegExp = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/** True when the text mentions this name as "@Name" (not followed by a letter or digit). */
export function mentionsName(text: string, name: string): boolean {
  return !!name.trim() && new RegExp(`@${escapeRegExp(name)}(?![\\p{L}\\p{N}])`, 'u').test(text);
}

/**
 * The user ids to send with a comment: members whose "@Name" is still in the text. When two
 * members share a name, only the ones picked from the list count.
 */
export function mentionIds(text: string, members: UserRef[], picked: ReadonlySet<string>): string[] {
  const named = members.filter((m) => mentionsName(text, m.displayName));
  return named
    .filter((m) => picked.has(m.id) || named.filter((o) => o.displayName === m.displayName).length === 1)
    .map((m) => m.id)
    .filter((id, i, all) => all.indexOf(id) === i);
}
