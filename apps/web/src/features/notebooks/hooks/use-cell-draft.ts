import type { CellView } from '@cribra/contracts';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef, useState } from 'react';
import { putCachedCell } from '../api/notebook-cache';
import { staleCell, useUpdateCell } from '../api/update-cell';

/** The saved cell a draft started from: its revision is the one the next save is sent against. */
interface Base {
  revision: number;
  source: string;
}

/**
 * The text being edited in one cell. The draft keeps the revision it started from (not the one
 * the cache holds now: a remote save moves the cache, and saving against it would silently drop
 * the other edit). A save that meets a newer revision becomes a conflict, kept until the author
 * keeps theirs, takes the saved one, or saves a merge of the two.
 */
export function useCellDraft(cell: CellView) {
  const qc = useQueryClient();
  const [base, setBaseState] = useState<Base>({ revision: cell.revision, source: cell.source });
  const [draft, setDraftState] = useState(cell.source);
  const [conflict, setConflict] = useState<CellView | null>(null);
  // Bumped whenever the text is replaced from outside the editor (saved version taken, remote change).
  const [replaceKey, setReplaceKey] = useState(0);
  const update = useUpdateCell();
  // Refs mirror the state so that async saves and the remote-change effect see the latest values.
  const baseRef = useRef(base);
  const draftRef = useRef(draft);
  const setBase = (b: Base) => {
    baseRef.current = b;
    setBaseState(b);
  };
  const setDraft = (text: string) => {
    draftRef.current = text;
    setDraftState(text);
  };
  const replaceText = (text: string) => {
    setDraft(text);
    setReplaceKey((k) => k + 1);
  };
  const dirty = draft !== base.source;

  // A remote change is taken over only while nothing is unsaved here; otherwise the draft stays on
  // its own base revision and the next save shows both texts.
  useEffect(() => {
    const b = baseRef.current;
    if (cell.revision <= b.revision) return;
    const clean = draftRef.current === b.source;
    if (clean) {
      setBase({ revision: cell.revision, source: cell.source });
      if (cell.source !== draftRef.current) replaceText(cell.source);
    } else if (cell.source === b.source || cell.source === draftRef.current) {
      // Only the kind changed, or the other save holds this very text: nothing to merge.
      setBase({ revision: cell.revision, source: cell.source === draftRef.current ? cell.source : b.source });
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps -- follows the server's cell only
  }, [cell.revision, cell.source]);

  const saveAt = async (revision: number, source: string, quietRetry = true): Promise<CellView | null> => {
    try {
      const saved = await update.mutateAsync({ id: cell.id, body: { revision, source } });
      setBase({ revision: saved.revision, source: saved.source });
      setConflict(null);
      return saved;
    } catch (err) {
      const current = staleCell(err);
      if (!current) throw err;
      // The revision moved but the text did not (a kind change): nothing to decide, save on top.
      if (quietRetry && current.source === baseRef.current.source) return saveAt(current.revision, source, false);
      setConflict(current);
      return null;
    }
  };

  return {
    draft,
    setDraft,
    replaceKey,
    dirty,
    /** The revision the draft started from (what the next save is sent against). */
    baseRevision: base.revision,
    /** True when the cell has a newer saved revision with other text than the one this draft started from. */
    behind: dirty && cell.revision > base.revision && cell.source !== base.source,
    saving: update.isPending,
    saveError: update.error && !staleCell(update.error) ? update.error : null,
    conflict,
    /**
     * Saves unsaved text (`text` when given: the editor's own, which may be ahead of the draft state)
     * against the draft's base revision; resolves to the saved cell, or null when a conflict stopped it.
     */
    save: (text: string = draftRef.current): Promise<CellView | null> => {
      if (text !== draftRef.current) setDraft(text);
      if (conflict) return Promise.resolve(null);
      const b = baseRef.current;
      return text !== b.source ? saveAt(b.revision, text) : Promise.resolve({ ...cell, revision: b.revision, source: b.source });
    },
    /** Saves this draft over the newer revision. */
    keepMine: () => (conflict ? saveAt(conflict.revision, draftRef.current, false) : Promise.resolve(null)),
    /** Saves `text` (a merge of both versions) over the newer revision and shows it in the editor. */
    saveMerge: async (text: string) => {
      if (!conflict) return null;
      const saved = await saveAt(conflict.revision, text, false);
      if (saved) replaceText(saved.source);
      return saved;
    },
    takeTheirs: () => {
      if (!conflict) return;
      putCachedCell(qc, conflict);
      setBase({ revision: conflict.revision, source: conflict.source });
      replaceText(conflict.source);
      setConflict(null);
    },
  };
}
