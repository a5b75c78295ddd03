import { ACTIVE_RUN_STATUSES, type NotebookEvent, type NotebookStateTopic, type NotebookView } from '@cribra/contracts';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { getRun } from './get-run';
import { notebookKeys } from './keys';
import { presenceKey } from './use-presence';
import { putCachedRun, updateCachedCells } from './notebook-cache';

/**
 * Follows GET /api/notebooks/:id/events (server-sent events): run progress goes straight into the
 * cached cells; a finished run is fetched whole (outputs); a new notebook revision refetches it;
 * a state change (status, review, re-verify, lock, members) refetches the notebook and is handed to
 * `onLive` (the route refreshes the side panel's queries with it). A finished run is handed on as
 * 'run' too: the review state counts runs still queued or running.
 */
export function useNotebookEvents(notebookId: string, onLive?: (topic: NotebookStateTopic | 'run') => void): void {
  const qc = useQueryClient();
  const live = useRef(onLive);
  live.current = onLive;
  useEffect(() => {
    if (typeof EventSource === 'undefined') return;
    const source = new EventSource(`/api/notebooks/${encodeURIComponent(notebookId)}/events`);
    const onRun = (msg: MessageEvent<string>) => {
      const event = JSON.parse(msg.data) as Extract<NotebookEvent, { type: 'run' }>;
      const r = event.run;
      updateCachedCells(qc, notebookId, (cells) =>
        cells.map((c) =>
          c.latestRun?.id === r.id
            ? { ...c, latestRun: { ...c.latestRun, status: r.status, progress: r.progress, progressNote: r.progressNote, outputDigest: r.outputDigest } }
            : c,
        ),
      );
      const known = qc.getQueryData<NotebookView>(notebookKeys.detail(notebookId))?.cells.some((c) => c.latestRun?.id === r.id);
      // A finished run brings its outputs; a run started elsewhere (another member) is fetched once.
      if (!ACTIVE_RUN_STATUSES.includes(r.status) || !known) void getRun(r.id).then((run) => putCachedRun(qc, run)).catch(() => undefined);
      if (!ACTIVE_RUN_STATUSES.includes(r.status) || !known) live.current?.('run');
    };
    const onState = (msg: MessageEvent<string>) => {
      const event = JSON.parse(msg.data) as Extract<NotebookEvent, { type: 'state' }>;
      if (event.topic === 'presence') return void qc.invalidateQueries({ queryKey: presenceKey(notebookId) });
      void qc.invalidateQueries({ queryKey: notebookKeys.detail(notebookId) });
      live.current?.(event.topic);
    };
    const onNotebook = (msg: MessageEvent<string>) => {
      const event = JSON.parse(msg.data) as Extract<NotebookEvent, { type: 'notebook' }>;
      const cached = qc.getQueryData<NotebookView>(notebookKeys.detail(notebookId));
      if (!cached || cached.revision < event.revision) void qc.invalidateQueries({ queryKey: notebookKeys.detail(notebookId) });
    };
    source.addEventListener('run', onRun);
    source.addEventListener('notebook', onNotebook);
    source.addEventListener('state', onState);
    return () => source.close();
  }, [notebookId, qc]);
}
