import { describe, expect, it } from 'vitest';
import { matchMembers, mentionIds, mentionQueryAt } from './mentions';

const a = { id: 'a', displayName: 'Teodor Quill' };
const b = { id: 'b', displayName: 'Teodor Quill' };
const c = { id: 'c', displayName: 'Anneke Voss' };

describe('mentionQueryAt', () => {
  it('finds "@" and letters before the caret, at the start or after a space', () => {
    expect(mentionQueryAt('@te', 3)).toEqual({ start: 0, query: 'te' });
    expect(mentionQueryAt('ask @Teodor Q now', 13)).toEqual({ start: 4, query: 'Teodor Q' });
    expect(mentionQueryAt('(@an', 4)).toEqual({ start: 1, query: 'an' });
  });

  it('ignores e-mail addresses, a bare "@", and text after a finished name', () => {
    expect(mentionQueryAt('mail t@te', 9)).toBeNull();
    expect(mentionQueryAt('@', 1)).toBeNull();
    expect(mentionQueryAt('@4', 2)).toBeNull();
    expect(mentionQueryAt('@Teodor Quill ', 14)).toBeNull();
  });
});

describe('matchMembers', () => {
  it('matches the start of the name or of any word, in any case', () => {
    expect(matchMembers([a, c], 'qu')).toEqual([a]);
    expect(matchMembers([a, c], 'ANN')).toEqual([c]);
    expect(matchMembers([a, c], 'nek')).toEqual([]);
  });
});

describe('mentionIds', () => {
  it('sends members whose "@Name" is still in the text, whole names only', () => {
    expect(mentionIds('see @Anneke Voss.', [a, c], new Set())).toEqual(['c']);
    expect(mentionIds('see @Anneke Vossberg', [a, c], new Set(['c']))).toEqual([]);
    expect(mentionIds('nobody', [a, c], new Set(['c']))).toEqual([]);
  });

  it('between two members of the same name, sends only the one picked', () => {
    expect(mentionIds('@Teodor Quill', [a, b], new Set(['b']))).toEqual(['b']);
    expect(mentionIds('@Teodor Quill', [a, b], new Set())).toEqual([]);
  });
});
