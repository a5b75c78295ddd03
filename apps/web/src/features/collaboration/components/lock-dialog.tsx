import type { ReviewStateView } from '@cribra/contracts';
import { Alert, Button, Dialog, DialogActions, DialogContent, DialogTitle, List, ListItem, ListItemText, Typography } from '@mui/material';
import { errorMessage } from '../../../lib/api-error';
import { formatDateTime } from '../../../lib/format';
import { useLockNotebook } from '../api/lock-notebook';

interface Props {
  notebookId: string;
  cellCount: number;
  state: ReviewStateView;
  onClose: () => void;
  onChanged: () => void;
}

/** What a lock freezes (revision digest, sign-offs, cells), with the caution about evidence and proof. */
export function LockDialog({ notebookId, cellCount, state, onClose, onChanged }: Props) {
  const lock = useLockNotebook(notebookId, onChanged);
  return (
    <Dialog open onClose={onClose} maxWidth="sm" fullWidth aria-labelledby="lock-title">
      <DialogTitle id="lock-title">Lock this notebook</DialogTitle>
      <DialogContent>
        <Typography sx={{ mb: 1 }}>Locking freezes revision {state.notebookRevision}: nobody can change its {cellCount} cells, runs or outputs afterwards.</Typography>
        <Typography className="mono" sx={{ fontSize: 12, wordBreak: 'break-all', mb: 1 }}>revision digest {state.revisionDigest}</Typography>
        <Typography variant="h4" component="h3">Sign-offs ({state.validSignoffs.length} of {state.requiredSignoffs} required)</Typography>
        <List dense>
          {state.validSignoffs.map((s) => (
            <ListItem key={s.id} disableGutters>
              <ListItemText primary={s.reviewer.displayName} secondary={`${formatDateTime(s.createdAt)} · ${s.comment}`} />
            </ListItem>
          ))}
        </List>
        <Alert severity="info" sx={{ mt: 1 }}>
          Computed evidence is not a proof. The lock records what was checked, over the ranges the claims state; it does not make a claim true beyond them.
        </Alert>
        {lock.isError && <Alert severity="error" sx={{ mt: 1 }}>{errorMessage(lock.error)}</Alert>}
      </DialogContent>
      <DialogActions>
        <Button onClick={onClose}>Not now</Button>
        <Button variant="contained" onClick={() => lock.mutate(undefined, { onSuccess: onClose })} disabled={lock.isPending}>Lock notebook</Button>
      </DialogActions>
    </Dialog>
  );
}
