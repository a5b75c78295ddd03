import { Alert, Box, Button, List, ListItem, ListItemText, Typography } from '@mui/material';
import { LoadingState } from '../../../components/loading-state';
import { errorMessage } from '../../../lib/api-error';
import { formatDateTime } from '../../../lib/format';
import { useLockRecord } from '../api/get-lock';
import { LockCheckSection } from './lock-check-section';

/** The record of a locked notebook, with its exports and (for members and admins) a re-check against it. */
export function LockRecordView({ notebookId, canCheck = false }: { notebookId: string; canCheck?: boolean }) {
  const lock = useLockRecord(notebookId, true);
  if (lock.isPending) return <LoadingState label="Loading the lock record…" />;
  if (lock.isError) return <Alert severity="error">{errorMessage(lock.error)}</Alert>;
  const r = lock.data;
  return (
    <Box component="section" aria-label="Lock record">
      <Typography variant="h4" component="h3">Lock record</Typography>
      <Typography variant="body2">Locked by {r.lockedBy.displayName}, {formatDateTime(r.lockedAt)}, at revision {r.notebookRevision}.</Typography>
      <Typography className="mono" sx={{ fontSize: 11, wordBreak: 'break-all', my: 0.5 }}>{r.revisionDigest}</Typography>
      <Typography variant="body2" color="text.secondary">engine {r.engineVersion} · Sift {r.languageVersion} · {r.cells.length} cells</Typography>
      <Typography variant="body2" color="text.secondary">
        Record SHA-256 <span className="mono" style={{ wordBreak: 'break-all' }}>{r.recordSha256}</span> · check it offline with <code>cribra verify</code> on the JSON
      </Typography>
      <List dense>
        {r.signers.map((s) => (
          <ListItem key={s.reviewId} disableGutters>
            <ListItemText primary={`Signed off by ${s.user.displayName}`} secondary={formatDateTime(s.signedAt)} />
          </ListItem>
        ))}
      </List>
      <Typography variant="body2" sx={{ fontStyle: 'italic', mb: 1 }}>Computed evidence over the stated ranges, not a proof.</Typography>
      <Box sx={{ display: 'flex', gap: 1 }}>
        <Button variant="outlined" href={`/api/notebooks/${notebookId}/lock/export?format=json`} download>Export JSON</Button>
        <Button variant="outlined" href={`/api/notebooks/${notebookId}/lock/export?format=markdown`} download>Export Markdown</Button>
      </Box>
      {canCheck && <LockCheckSection notebookId={notebookId} />}
    </Box>
  );
}
