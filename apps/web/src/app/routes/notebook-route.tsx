import { useQueryClient } from '@tanstack/react-query';
import { CollaborationPanel } from '../../features/collaboration/components/collaboration-panel';
import { notebookKeys } from '../../features/notebooks/api/keys';
import NotebookPage from '../../features/notebooks/pages/notebook-page';
import { useCurrentUser } from '../../lib/current-user';

/** The notebook page with the collaboration panel beside it (the route composes the two features). */
export default function NotebookRoute() {
  const qc = useQueryClient();
  const me = useCurrentUser();
  return (
    <NotebookPage
      sidePanel={(nb) => (
        <CollaborationPanel
          notebook={nb}
          userId={me.data?.id}
          siteRole={me.data?.siteRole}
          onNotebookChanged={() => {
            void qc.invalidateQueries({ queryKey: notebookKeys.detail(nb.id) });
            void qc.invalidateQueries({ queryKey: notebookKeys.lists() });
          }}
        />
      )}
    />
  );
}
