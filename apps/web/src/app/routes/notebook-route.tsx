import { useQueryClient } from '@tanstack/react-query';
import { refreshCollaboration } from '../../features/collaboration/api/refresh-live';
import { CollaborationPanel } from '../../features/collaboration/components/collaboration-panel';
import { notebookKeys } from '../../features/notebooks/api/keys';
import { canEditCells } from '../../features/notebooks/lib/permissions';
import NotebookPage from '../../features/notebooks/pages/notebook-page';
import { PublishSection } from '../../features/records/components/publish-section';
import { UploadsSection } from '../../features/uploads/components/uploads-section';
import { useCurrentUser } from '../../lib/current-user';

/** The notebook page with the collaboration panel beside it (the route composes the two features). */
export default function NotebookRoute() {
  const qc = useQueryClient();
  const me = useCurrentUser();
  return (
    <NotebookPage
      onLiveChange={(notebookId, topic) => refreshCollaboration(qc, notebookId, topic)}
      sidePanel={(nb) => (
        <CollaborationPanel
          notebook={nb}
          userId={me.data?.id}
          siteRole={me.data?.siteRole}
          extraTabs={[
            {
              value: 'files',
              label: 'Files',
              content: <UploadsSection notebookId={nb.id} canEdit={canEditCells({ myRole: nb.myRole, status: nb.status, siteRole: me.data?.siteRole })} />,
            },
            // A locked notebook's record can be published (owner, admins: the `record.publish` row of the permission table).
            ...(nb.status === 'locked'
              ? [{
                  value: 'publication',
                  label: 'Publish',
                  content: <PublishSection notebookId={nb.id} canPublish={nb.myRole === 'owner' || me.data?.siteRole === 'admin'} />,
                }]
              : []),
          ]}
          onNotebookChanged={() => {
            void qc.invalidateQueries({ queryKey: notebookKeys.detail(nb.id) });
            void qc.invalidateQueries({ queryKey: notebookKeys.lists() });
          }}
        />
      )}
    />
  );
}
