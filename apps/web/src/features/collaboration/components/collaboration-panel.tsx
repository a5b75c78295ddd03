import type { NotebookView, SiteRole } from '@cribra/contracts';
import { Box, Paper, Tab, Tabs } from '@mui/material';
import { type ReactNode, useState } from 'react';
import { canReadHistory } from '../lib/who-may';
import { CommentsSection } from './comments-section';
import { HistorySection } from './history-section';
import { MembersSection } from './members-section';
import { ReviewSection } from './review-section';

interface Props {
  notebook: NotebookView;
  userId?: string;
  siteRole?: SiteRole;
  /** Called after a change of the notebook's status (review asked, sign-off, lock). */
  onNotebookChanged: () => void;
  /** More tabs composed in by the route (e.g. the notebook's files). */
  extraTabs?: Array<{ value: string; label: string; content: ReactNode }>;
}

/** The side panel beside the cells: review and lock, members and invitations, comments, history (owner, admins). */
export function CollaborationPanel({ notebook, userId, siteRole, onNotebookChanged, extraTabs = [] }: Props) {
  const [selected, setTab] = useState<string>('review');
  const showHistory = canReadHistory({ myRole: notebook.myRole, siteRole });
  // A tab that went away (e.g. History after a change of role) falls back to Review.
  const tab = selected === 'history' && !showHistory ? 'review' : selected;
  const extra = extraTabs.find((t) => t.value === tab);
  // Five tabs do not fit the panel's width side by side: they scroll instead.
  const scroll = 3 + extraTabs.length + (showHistory ? 1 : 0) > 4;
  return (
    <Paper sx={{ maxHeight: 'calc(100vh - 80px)', overflowY: 'auto' }}>
      <Tabs value={tab} onChange={(_, t) => setTab(t)} variant={scroll ? 'scrollable' : 'fullWidth'} scrollButtons={scroll ? 'auto' : false}
        aria-label="Collaboration" sx={{ '& .MuiTab-root': { minWidth: 0, px: 1 } }}>
        <Tab value="review" label="Review" id="collab-tab-review" aria-controls="collab-panel-review" />
        <Tab value="members" label="Members" id="collab-tab-members" aria-controls="collab-panel-members" />
        <Tab value="comments" label="Comments" id="collab-tab-comments" aria-controls="collab-panel-comments" />
        {extraTabs.map((t) => (
          <Tab key={t.value} value={t.value} label={t.label} id={`collab-tab-${t.value}`} aria-controls={`collab-panel-${t.value}`} />
        ))}
        {showHistory && <Tab value="history" label="History" id="collab-tab-history" aria-controls="collab-panel-history" />}
      </Tabs>
      <Box role="tabpanel" id={`collab-panel-${tab}`} aria-labelledby={`collab-tab-${tab}`} sx={{ p: 2 }}>
        {tab === 'review' && <ReviewSection notebook={notebook} userId={userId} siteRole={siteRole} onChanged={onNotebookChanged} />}
        {tab === 'members' && <MembersSection notebook={notebook} canManage={notebook.myRole === 'owner' || siteRole === 'admin'} onChanged={onNotebookChanged} />}
        {tab === 'comments' && (
          <CommentsSection notebook={notebook} canWrite={notebook.status !== 'locked' && (['owner', 'editor', 'reviewer'] as const).some((r) => r === notebook.myRole)} />
        )}
        {tab === 'history' && <HistorySection notebook={notebook} />}
        {extra?.content}
      </Box>
    </Paper>
  );
}
