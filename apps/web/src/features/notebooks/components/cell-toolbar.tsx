import ArrowDownwardIcon from '@mui/icons-material/ArrowDownward';
import ArrowUpwardIcon from '@mui/icons-material/ArrowUpward';
import DeleteOutlineIcon from '@mui/icons-material/DeleteOutlined';
import HistoryIcon from '@mui/icons-material/History';
import { Box, Button, IconButton, Tooltip } from '@mui/material';

interface Props {
  runnable: boolean;
  canRun: boolean;
  canEdit: boolean;
  active: boolean;
  dirty: boolean;
  saving: boolean;
  isFirst: boolean;
  isLast: boolean;
  historyOpen: boolean;
  onRun: () => void;
  onCancel: () => void;
  onSave: () => void;
  onMove: (by: -1 | 1) => void;
  onDelete: () => void;
  onToggleHistory: () => void;
}

export function CellToolbar(p: Props) {
  return (
    <Box sx={{ display: 'flex', alignItems: 'center', gap: 0.5 }}>
      {p.canEdit && p.dirty && <Button onClick={p.onSave} disabled={p.saving}>{p.saving ? 'Saving…' : 'Save'}</Button>}
      {p.runnable && p.canRun && !p.active && (
        <Tooltip title="Ctrl+Enter in the editor" describeChild><Button variant="contained" onClick={p.onRun}>Run</Button></Tooltip>
      )}
      {p.runnable && p.canRun && p.active && <Button color="error" variant="outlined" onClick={p.onCancel}>Cancel run</Button>}
      {p.runnable && (
        <Tooltip title="Run history">
          <IconButton size="small" aria-label="Run history" aria-pressed={p.historyOpen} onClick={p.onToggleHistory}><HistoryIcon fontSize="small" /></IconButton>
        </Tooltip>
      )}
      {p.canEdit && (
        <>
          <IconButton size="small" aria-label="Move cell up" disabled={p.isFirst} onClick={() => p.onMove(-1)}><ArrowUpwardIcon fontSize="small" /></IconButton>
          <IconButton size="small" aria-label="Move cell down" disabled={p.isLast} onClick={() => p.onMove(1)}><ArrowDownwardIcon fontSize="small" /></IconButton>
          <IconButton size="small" aria-label="Delete cell" onClick={p.onDelete}><DeleteOutlineIcon fontSize="small" /></IconButton>
        </>
      )}
    </Box>
  );
}
