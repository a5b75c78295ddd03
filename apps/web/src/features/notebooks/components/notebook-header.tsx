import type { NotebookView } from '@cribra/contracts';
import { Box, Button, Chip, Typography } from '@mui/material';
import type { ReactNode } from 'react';
import { formatDateTime } from '../../../lib/format';
import { STATUS_COLOUR, STATUS_LABEL } from '../lib/status-label';

interface Props {
  notebook: NotebookView;
  canRun: boolean;
  runningAll: boolean;
  onRunAll: () => void;
  /** Opens the notebook settings; the button is shown only when given (the page passes it to those who may edit). */
  onEditSettings?: () => void;
  actions?: ReactNode;
  /** Cells are editable here: the keyboard hint is shown (it is hidden on a read-only notebook). */
  canEdit: boolean;
}

export function NotebookHeader({ notebook: nb, canRun, runningAll, onRunAll, onEditSettings, actions, canEdit }: Props) {
  return (
    <Box component="header" sx={{ mb: 2 }}>
      <Box sx={{ display: 'flex', alignItems: 'center', gap: 1.5, flexWrap: 'wrap' }}>
        <Typography variant="h1" sx={{ flex: 1, minWidth: 280 }}>{nb.title}</Typography>
        <Chip label={STATUS_LABEL[nb.status]} color={STATUS_COLOUR[nb.status]} />
        {canRun && (
          <Button variant="contained" size="medium" onClick={onRunAll} disabled={runningAll}>
            {runningAll ? 'Queuing…' : 'Run all'}
          </Button>
        )}
        {onEditSettings && <Button variant="outlined" onClick={onEditSettings}>Settings</Button>}
        <Button variant="outlined" href={`/api/notebooks/${nb.id}/export?format=markdown`} download>Export Markdown</Button>
        <Button variant="outlined" href={`/api/notebooks/${nb.id}/export?format=latex`} download>Export LaTeX</Button>
        <Button variant="outlined" href={`/api/notebooks/${nb.id}/export?format=sift`} download title="The cells as a notebook file, for cribra run or New notebook from file">Export .sift</Button>
        {actions}
      </Box>
      {nb.summary && <Typography sx={{ mt: 1, maxWidth: 900 }}>{nb.summary}</Typography>}
      <Typography variant="caption" color="text.secondary" component="p" className="mono" sx={{ mt: 0.5 }}>
        rev {nb.revision} · owner {nb.owner.displayName} · my role {nb.myRole ?? 'none (admin)'} · {nb.requiredSignoffs} sign-off{nb.requiredSignoffs === 1 ? '' : 's'} required · updated {formatDateTime(nb.updatedAt)}
        {nb.tags.length > 0 && ` · ${nb.tags.join(', ')}`}
      </Typography>
      {canEdit && (
        <Typography variant="caption" color="text.secondary" component="p" data-testid="shortcut-hint">
          In the cell being edited: {canRun && <><kbd>Ctrl</kbd>+<kbd>Enter</kbd> saves and runs it · </>}<kbd>Ctrl</kbd>+<kbd>S</kbd> saves it ·
          {' '}<kbd>Ctrl</kbd>+<kbd>Alt</kbd>+<kbd>N</kbd> adds a query below it · <kbd>Ctrl</kbd>+<kbd>M</kbd> lets <kbd>Tab</kbd> leave the editor
        </Typography>
      )}
    </Box>
  );
}
