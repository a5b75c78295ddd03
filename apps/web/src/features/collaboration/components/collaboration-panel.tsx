import type { NotebookView, SiteRole } from '@cribra/contracts';
import { Box, Paper, Tab, Tabs } from '@mui/material';
import { useState } from 'react';
import { MembersSection } from './members-section';
import { ReviewSection } from './review-section';

interface Props {
  notebook: NotebookView;
  userId?: string;
  siteRole?: SiteRole;
  /** Called after a change of the notebook's status (review asked, sign-off, lock). */
  onNotebookChanged: () => void;
}

/** The side panel beside the cells: review and lock, members and invitations. */
export function CollaborationPanel({ notebook, userId, siteRole, onNotebookChanged }: Props) {
  const [tab, setTab] = useState<'review' | 'members'>('review');
  return (
    <Paper sx={{ maxHeight: 'calc(100vh - 80px)', overflowY: 'auto' }}>
      <Tabs value={tab} onChange={(_, t) => setTab(t)} variant="fullWidth" aria-label="Collaboration">
        <Tab value="review" label="Review" id="collab-tab-review" aria-controls="collab-panel-review" />
        <Tab value="members" label="Members" id="collab-tab-members" aria-controls="collab-panel-members" />
      </Tabs>
      <Box role="tabpanel" id={`collab-panel-${tab}`} aria-labelledby={`collab-tab-${tab}`} sx={{ p: 2 }}>
        {tab === 'review' ? (
          <ReviewSection notebook={notebook} userId={userId} siteRole={siteRole} onChanged={onNotebookChanged} />
        ) : (
          <MembersSection notebook={notebook} canManage={notebook.myRole === 'owner' || siteRole === 'admin'} />
        )}
      </Box>
    </Paper>
  );
}
