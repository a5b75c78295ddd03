import type { CellView } from '@cribra/contracts';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef, useState } from 'react';
import { putCachedCell } from '../api/notebook-cache';
import { staleCell, useUpdateCell } from '../api/update-cell';

/**
 * The text being edited in one cell, saved with the revision it started from. A stale save (409)
 * is kept as a conflict until the author keeps their version or takes the saved one.
 */
export function useCellDraft(cell: CellView) {
  const qc = useQueryClient();
  const [draft, setDraft] = useState(cell.source);
  const [conflict, setConflict] = useState<CellView | null>(null);
  // Bumped whenever the text is replaced from outside the editor (saved version taken, remote change).
  const [replaceKey, setReplaceKey] = useState(0);
  const update = useUpdateCell();
  const dirty = draft !== cell.source;
  const lastServerSource = useRef(cell.source);
  const draftRef = useRef(draft);
  draftRef.current = draft;

  // Someone else's saved change replaces the text only while there is nothing unsaved here.
  useEffect(() => {
    if (cell.source !== lastServerSource.current) {
      if (draftRef.current === lastServerSource.current) {
        setDraft(cell.source);
        setReplaceKey((k) => k + 1);
      }
      lastServerSource.current = cell.source;
    }
  }, [cell.source]);

  const saveAt = async (revision: number, source: string): Promise<CellView | null> => {
    try {
      const saved = await update.mutateAsync({ id: cell.id, body: { revision, source } });
      lastServerSource.current = saved.source;
      setConflict(null);
      return saved;
    } catch (err) {
      const current = staleCell(err);
      if (current) setConflict(current);
      else throw err;
      return null;
    }
  };

  return {
    draft,
    setDraft,
    replaceKey,
    dirty,
    saving: update.isPending,
    saveError: update.error && !staleCell(update.error) ? update.error : null,
    conflict,
    /**
     * Saves unsaved text (`text` when given: the editor's own, which may be ahead of the draft state);
     * resolves to the saved cell, or null when a conflict stopped it.
     */
    save: (text: string = draft): Promise<CellView | null> => {
      if (text !== draft) setDraft(text);
      return text !== cell.source ? saveAt(cell.revision, text) : Promise.resolve(cell);
    },
    keepMine: () => (conflict ? saveAt(conflict.revision, draft) : Promise.resolve(null)),
    takeTheirs: () => {
      if (!conflict) return;
      putCachedCell(qc, conflict);
      lastServerSource.current = conflict.source;
      setDraft(conflict.source);
      setReplaceKey((k) => k + 1);
      setConflict(null);
    },
    dismissConflict: () => setConflict(null),
  };
}
