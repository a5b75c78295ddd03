import type { NotebookView } from '@cribra/contracts';
import { Button, List, ListItem, ListItemText, Stack, Typography } from '@mui/material';
import { useMemo, useState } from 'react';
import { ErrorState } from '../../../components/error-state';
import { LoadingState } from '../../../components/loading-state';
import { formatDateTime } from '../../../lib/format';
import { AUDIT_LIST_LIMIT, useNotebookAudit } from '../api/list-audit';
import { auditSentence } from '../lib/audit-sentence';

/** How many events are shown at first, and added by each "Show older events". */
export const HISTORY_PAGE = 25;

/** What happened to the notebook, newest first, as sentences (owner and admins). */
export function HistorySection({ notebook }: { notebook: NotebookView }) {
  const audit = useNotebookAudit(notebook.id);
  const [shown, setShown] = useState(HISTORY_PAGE);
  const names = useMemo(() => new Map(notebook.members.map((m) => [m.userId, m.displayName])), [notebook.members]);
  const events = useMemo(() => [...(audit.data ?? [])].sort((a, b) => b.at.localeCompare(a.at)), [audit.data]);

  return (
    <Stack spacing={1.5}>
      <Typography variant="h4" component="h3">History</Typography>
      {audit.isPending && <LoadingState label="Loading the history…" />}
      {audit.isError && <ErrorState error={audit.error} title="Could not load the history" onRetry={() => audit.refetch()} />}
      {audit.isSuccess && events.length === 0 && <Typography color="text.secondary">Nothing has been recorded for this notebook yet.</Typography>}
      {events.length > 0 && (
        <List dense disablePadding aria-label="Notebook history">
          {events.slice(0, shown).map((e) => (
            <ListItem key={e.id} disableGutters divider>
              <ListItemText primary={auditSentence(e, names)} secondary={<time dateTime={e.at}>{formatDateTime(e.at)}</time>} />
            </ListItem>
          ))}
        </List>
      )}
      {events.length > shown && (
        <Button variant="text" onClick={() => setShown((n) => n + HISTORY_PAGE)} sx={{ alignSelf: 'flex-start' }}>
          Show older events ({events.length - shown} more)
        </Button>
      )}
      {events.length >= AUDIT_LIST_LIMIT && events.length <= shown && (
        <Typography variant="caption" color="text.secondary">Only the latest {AUDIT_LIST_LIMIT} events are listed.</Typography>
      )}
    </Stack>
  );
}
