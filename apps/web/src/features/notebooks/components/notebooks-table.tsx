import type { NotebookSummary } from '@cribra/contracts';
import { Box, Button, Chip, Link, Table, TableBody, TableCell, TableHead, TableRow, Typography } from '@mui/material';
import { Link as RouterLink } from 'react-router-dom';
import { formatDateTime } from '../../../lib/format';
import { STATUS_COLOUR, STATUS_LABEL } from '../lib/status-label';

interface Props {
  notebooks: NotebookSummary[];
  onDuplicate: (nb: NotebookSummary) => void;
  duplicatingId?: string;
}

export function NotebooksTable({ notebooks, onDuplicate, duplicatingId }: Props) {
  return (
    <Table size="small" aria-label="Notebooks">
      <TableHead>
        <TableRow>
          <TableCell>Title</TableCell>
          <TableCell>Status</TableCell>
          <TableCell>Owner</TableCell>
          <TableCell>My role</TableCell>
          <TableCell align="right">Cells</TableCell>
          <TableCell>Updated</TableCell>
          <TableCell><span className="visually-hidden">Actions</span></TableCell>
        </TableRow>
      </TableHead>
      <TableBody>
        {notebooks.map((nb) => (
          <TableRow key={nb.id} hover>
            <TableCell sx={{ maxWidth: 420 }}>
              <Link component={RouterLink} to={`/notebooks/${nb.id}`} sx={{ fontWeight: 600 }}>{nb.title}</Link>
              {nb.summary && <Typography variant="body2" color="text.secondary" noWrap>{nb.summary}</Typography>}
              <Box sx={{ display: 'flex', gap: 0.5, flexWrap: 'wrap', mt: 0.5 }}>
                {nb.tags.map((t) => <Chip key={t} label={t} size="small" variant="outlined" />)}
              </Box>
            </TableCell>
            <TableCell><Chip size="small" label={STATUS_LABEL[nb.status]} color={STATUS_COLOUR[nb.status]} /></TableCell>
            <TableCell>{nb.owner.displayName}</TableCell>
            <TableCell>{nb.myRole ?? '—'}</TableCell>
            <TableCell align="right" className="mono">{nb.cellCount}</TableCell>
            <TableCell>{formatDateTime(nb.updatedAt)}</TableCell>
            <TableCell>
              <Button onClick={() => onDuplicate(nb)} disabled={duplicatingId === nb.id} aria-label={`Duplicate ${nb.title}`}>
                {duplicatingId === nb.id ? 'Copying…' : 'Duplicate'}
              </Button>
            </TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
