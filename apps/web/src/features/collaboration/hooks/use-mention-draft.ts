import type { UserRef } from '@cribra/contracts';
import { useState } from 'react';
import { mentionIds } from '../lib/mentions';

/** Text of a comment being written, the members picked from the mention list, and the ids to send. */
export function useMentionDraft(initialText = '', initialPicked: string[] = []) {
  const [text, setText] = useState(initialText);
  const [picked, setPicked] = useState<ReadonlySet<string>>(() => new Set(initialPicked));
  return {
    text,
    setText,
    pick: (member: UserRef) => setPicked((p) => new Set(p).add(member.id)),
    /** Ids of the members whose "@Name" is in the text now. */
    mentions: (members: UserRef[]) => mentionIds(text, members, picked),
    reset: () => {
      setText('');
      setPicked(new Set());
    },
  };
}
