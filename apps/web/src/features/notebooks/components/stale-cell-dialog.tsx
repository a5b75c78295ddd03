import type { CellView } from '@cribra/contracts';
import { Box, Button, Dialog, DialogActions, DialogContent, DialogContentText, DialogTitle, Typography } from '@mui/material';
import { monoFont } from '../../../lib/design-tokens';

interface Props {
  mine: string;
  theirs: CellView;
  onKeepMine: () => void;
  onTakeTheirs: () => void;
  onClose: () => void;
}

const Version = ({ title, text }: { title: string; text: string }) => (
  <Box sx={{ flex: 1, minWidth: 0 }}>
    <Typography variant="h4" component="h3" sx={{ mb: 0.5 }}>{title}</Typography>
    <Box component="pre" sx={{ fontFamily: monoFont, fontSize: 12, m: 0, p: 1, border: 1, borderColor: 'divider', borderRadius: 1, maxHeight: 360, overflow: 'auto', whiteSpace: 'pre-wrap' }}>
      {text}
    </Box>
  </Box>
);

/** A save refused as stale: both versions side by side; the author chooses which one stays. */
export function StaleCellDialog({ mine, theirs, onKeepMine, onTakeTheirs, onClose }: Props) {
  return (
    <Dialog open onClose={onClose} maxWidth="lg" fullWidth aria-labelledby="stale-title">
      <DialogTitle id="stale-title">This cell changed while you were editing</DialogTitle>
      <DialogContent>
        <DialogContentText sx={{ mb: 2 }}>
          {theirs.author.displayName} saved revision {theirs.revision}. Choose the version to keep.
        </DialogContentText>
        <Box sx={{ display: 'flex', gap: 2 }}>
          <Version title="Your version (not saved)" text={mine} />
          <Version title={`Saved version (rev ${theirs.revision})`} text={theirs.source} />
        </Box>
      </DialogContent>
      <DialogActions>
        <Button onClick={onTakeTheirs}>Take the saved version</Button>
        <Button variant="contained" onClick={onKeepMine}>Keep mine (save over it)</Button>
      </DialogActions>
    </Dialog>
  );
}
