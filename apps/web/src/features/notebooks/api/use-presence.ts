import { PRESENCE_BEAT_MS, type PresenceView } from '@cribra/contracts';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useMemo } from 'react';
import { api, apiRequest } from '../../../lib/api-client';
import { notebookKeys } from './keys';

export const presenceKey = (notebookId: string) => [...notebookKeys.all, 'presence', notebookId] as const;

/**
 * This tab's presence in a notebook: a heartbeat every PRESENCE_BEAT_MS and whenever the focused
 * cell changes, a goodbye when the page goes (keepalive, so it survives the tab closing). Returns
 * the other people here (refetched on `presence` events of the notebook's stream, and with each beat).
 */
export function usePresence(notebookId: string, myId: string | undefined, editingCellId: string | null): PresenceView[] {
  const qc = useQueryClient();
  const tabId = useMemo(() => crypto.randomUUID().replace(/-/g, ''), []);
  const path = `/notebooks/${notebookId}/presence`;
  useEffect(() => {
    let stopped = false;
    const beat = () =>
      api
        .put<PresenceView[]>(path, { tabId, cellId: editingCellId })
        .then((list) => !stopped && qc.setQueryData(presenceKey(notebookId), list))
        .catch(() => undefined);
    void beat();
    const t = window.setInterval(beat, PRESENCE_BEAT_MS);
    return () => {
      stopped = true;
      window.clearInterval(t);
    };
  }, [path, tabId, editingCellId, notebookId, qc]);
  useEffect(() => {
    const leave = () => void apiRequest(`${path}/${tabId}`, { method: 'DELETE', keepalive: true }).catch(() => undefined);
    window.addEventListener('pagehide', leave);
    return () => {
      window.removeEventListener('pagehide', leave);
      leave();
    };
  }, [path, tabId]);
  const q = useQuery({
    queryKey: presenceKey(notebookId),
    queryFn: ({ signal }) => api.get<PresenceView[]>(path, { signal }),
    refetchInterval: PRESENCE_BEAT_MS * 1.5,
  });
  return (q.data ?? []).filter((p) => p.user.id !== myId);
}
