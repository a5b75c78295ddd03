import { Alert, Table, TableBody, TableCell, TableHead, TableRow } from '@mui/material';
import { LoadingState } from '../../../components/loading-state';
import { errorMessage } from '../../../lib/api-error';
import { formatDateTime } from '../../../lib/format';
import { useCellRuns } from '../api/list-cell-runs';

/** Earlier runs of one cell, newest first. */
export function RunHistory({ cellId }: { cellId: string }) {
  const runs = useCellRuns(cellId, true);
  if (runs.isPending) return <LoadingState label="Loading run history…" />;
  if (runs.isError) return <Alert severity="error">{errorMessage(runs.error)}</Alert>;
  if (runs.data.items.length === 0) return <Alert severity="info">This cell has not been run yet.</Alert>;
  return (
    <Table size="small" aria-label="Run history">
      <TableHead>
        <TableRow>
          <TableCell>Queued</TableCell>
          <TableCell>Rev</TableCell>
          <TableCell>Purpose</TableCell>
          <TableCell>Status</TableCell>
          <TableCell>By</TableCell>
          <TableCell align="right">ms</TableCell>
          <TableCell>Digest</TableCell>
        </TableRow>
      </TableHead>
      <TableBody>
        {runs.data.items.map((r) => (
          <TableRow key={r.id}>
            <TableCell>{formatDateTime(r.queuedAt)}</TableCell>
            <TableCell className="mono">{r.cellRevision}</TableCell>
            <TableCell>{r.purpose === 'reverify' ? 're-verify' : 'run'}</TableCell>
            <TableCell>{r.status}{r.error ? `: ${r.error.message}` : ''}</TableCell>
            <TableCell>{r.requestedBy.displayName}</TableCell>
            <TableCell align="right" className="mono">{r.durationMs ?? '—'}</TableCell>
            <TableCell className="mono">{r.outputDigest?.slice(0, 12) ?? '—'}</TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
