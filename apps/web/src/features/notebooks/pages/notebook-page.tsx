import type { NotebookStateTopic, NotebookView } from '@cribra/contracts';
import { Alert, Box, Button } from '@mui/material';
import { type ReactNode, useState } from 'react';
import { useParams } from 'react-router-dom';
import { ErrorState } from '../../../components/error-state';
import { LoadingState } from '../../../components/loading-state';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { errorMessage } from '../../../lib/api-error';
import { useCurrentUser } from '../../../lib/current-user';
import { useNotebook } from '../api/get-notebook';
import { useRunAll } from '../api/run-all';
import { useNotebookEvents } from '../api/use-notebook-events';
import { usePresence } from '../api/use-presence';
import { PresenceBar } from '../components/presence-bar';
import { CellList } from '../components/cell-list';
import { NotebookHeader } from '../components/notebook-header';
import { NotebookSettingsDialog } from '../components/notebook-settings-dialog';
import { canEditCells, canRun } from '../lib/permissions';

interface Props {
  /** The collaboration side panel, composed in by the route (features do not import each other). */
  sidePanel?: (notebook: NotebookView) => ReactNode;
  /** Extra header actions (export, lock…), composed in by the route. */
  headerActions?: (notebook: NotebookView) => ReactNode;
  /** Told of every live change heard on the notebook's event stream (the route refreshes the side panel). */
  onLiveChange?: (notebookId: string, topic: NotebookStateTopic | 'run') => void;
}

export default function NotebookPage({ sidePanel, headerActions, onLiveChange }: Props) {
  const { id = '' } = useParams();
  const nb = useNotebook(id);
  const me = useCurrentUser();
  const runAll = useRunAll(id);
  const [settingsOpen, setSettingsOpen] = useState(false);
  const [editingCellId, setEditingCellId] = useState<string | null>(null);
  const others = usePresence(id, me.data?.id, editingCellId);
  const editingBy = new Map<string, string[]>();
  for (const p of others) if (p.editingCellId) editingBy.set(p.editingCellId, [...(editingBy.get(p.editingCellId) ?? []), p.user.displayName]);
  useNotebookEvents(id, (topic) => onLiveChange?.(id, topic));
  useDocumentTitle(nb.data?.title ?? 'Notebook');

  if (nb.isPending) return <LoadingState label="Loading the notebook…" />;
  // A failed refresh keeps the page (and every unsaved draft and open dialog) and says so; only a
  // notebook that never loaded gets the error screen.
  if (!nb.data) return <ErrorState error={nb.error} title="Could not open this notebook" onRetry={() => nb.refetch()} />;
  const notebook = nb.data;
  const who = { myRole: notebook.myRole, status: notebook.status, siteRole: me.data?.siteRole };
  const panel = sidePanel?.(notebook);
  const canEdit = canEditCells(who);

  return (
    <Box sx={{ display: 'grid', gridTemplateColumns: panel ? 'minmax(0, 1fr) 340px' : 'minmax(0, 1fr)', gap: 3, alignItems: 'start' }}>
      <Box component="article" aria-label="Notebook">
        <NotebookHeader notebook={notebook} canRun={canRun(who)} runningAll={runAll.isPending} onRunAll={() => runAll.mutate()}
          onEditSettings={canEdit ? () => setSettingsOpen(true) : undefined} actions={headerActions?.(notebook)} canEdit={canEdit} />
        <PresenceBar others={others} />
        {/* Kept mounted while open even if the notebook gets locked meanwhile, so the input is not lost. */}
        {settingsOpen && <NotebookSettingsDialog notebook={notebook} onClose={() => setSettingsOpen(false)} />}
        {nb.isError && (
          <Alert severity="warning" sx={{ mb: 2 }} action={<Button color="inherit" size="small" onClick={() => nb.refetch()}>Retry</Button>}>
            Could not refresh the notebook ({errorMessage(nb.error)}). This is what was last loaded; nothing you typed was lost.
          </Alert>
        )}
        {notebook.status === 'locked' && (
          <Alert severity="info" sx={{ mb: 2 }}>This notebook is locked: it opens read-only, as it was signed off.</Alert>
        )}
        {runAll.isError && <Alert severity="error" sx={{ mb: 2 }}>{errorMessage(runAll.error)}</Alert>}
        <CellList notebook={notebook} canEdit={canEdit} canRun={canRun(who)} editingBy={editingBy} onEditingChange={setEditingCellId} />
      </Box>
      {panel && <Box component="aside" aria-label="Collaboration" sx={{ position: 'sticky', top: 64 }}>{panel}</Box>}
    </Box>
  );
}
