import { Button, Dialog, DialogActions, DialogContent, DialogContentText, DialogTitle } from '@mui/material';
import { formatDuration } from '../lib/estimate';

interface Props {
  what: string;
  estimateMs: number;
  onConfirm: () => void;
  onClose: () => void;
}

/** A computation estimated above a minute asks first, with the estimate and where it comes from. */
export function EstimateDialog({ what, estimateMs, onConfirm, onClose }: Props) {
  return (
    <Dialog open onClose={onClose} aria-labelledby="estimate-title">
      <DialogTitle id="estimate-title">Start a long computation?</DialogTitle>
      <DialogContent>
        <DialogContentText>
          {what} is estimated at about {formatDuration(estimateMs)} on one runner (from the measured costs in docs/scaling.md;
          more runners share the work). You can follow it and cancel it here; what is stored by then is kept.
        </DialogContentText>
      </DialogContent>
      <DialogActions>
        <Button onClick={onClose}>Not now</Button>
        <Button variant="contained" onClick={onConfirm}>Start it</Button>
      </DialogActions>
    </Dialog>
  );
}
