import type { CellView } from '@cribra/contracts';
import { Typography } from '@mui/material';
import { formatDateTime } from '../../../lib/format';

/** revision · runner · finished · duration · digest prefix (and a warning when the output is of an older revision). */
export function CellStatusLine({ cell, dirty }: { cell: CellView; dirty: boolean }) {
  const run = cell.latestRun;
  const parts = [`rev ${cell.revision}`, `by ${cell.author.displayName}`];
  if (run) {
    parts.push(`run ${run.status}`);
    if (run.runnerId) parts.push(`runner ${run.runnerId}`);
    if (run.finishedAt) parts.push(formatDateTime(run.finishedAt));
    if (run.durationMs !== null) parts.push(`${run.durationMs} ms`);
    if (run.outputDigest) parts.push(`digest ${run.outputDigest.slice(0, 12)}`);
  } else {
    parts.push('not run yet');
  }
  const stale = run && run.cellRevision !== cell.revision;
  return (
    <Typography variant="caption" color="text.secondary" component="p" className="mono" data-testid="cell-status">
      {parts.join(' · ')}
      {stale && <strong> · output is of rev {run.cellRevision}; run again</strong>}
      {dirty && <strong> · unsaved changes</strong>}
    </Typography>
  );
}
