import type { ComputationView } from '@cribra/contracts';
import { Box, Button, LinearProgress, Typography } from '@mui/material';
import { useEffect, useState } from 'react';
import { isActive } from '../api/list-computations';
import { formatDuration, progressFigures } from '../lib/estimate';

interface Props {
  computation: ComputationView;
  /** "block" or "chunk". */
  unit: string;
  label: string;
  onCancel?: () => void;
  cancelling?: boolean;
}

/** Done of total, elapsed, time left, and Cancel while it runs; the outcome once it ended. */
export function ComputationProgress({ computation: c, unit, label, onCancel, cancelling }: Props) {
  const active = isActive(c);
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (!active) return;
    const t = window.setInterval(() => setNow(Date.now()), 1000);
    return () => window.clearInterval(t);
  }, [active]);
  const f = progressFigures(c, now);
  const pct = f.total ? Math.round((100 * f.done) / f.total) : 0;
  const units = `${f.done} of ${f.total || '?'} ${unit}${f.total === 1 ? '' : 's'}`;
  const text = active
    ? `${c.status === 'queued' ? 'Queued' : 'Running'}: ${units} · elapsed ${formatDuration(f.elapsedMs)}${f.leftMs === null ? '' : ` · about ${formatDuration(f.leftMs)} left`}`
    : `${c.status === 'succeeded' ? 'Done' : c.status === 'cancelled' ? 'Cancelled' : 'Failed'}: ${units} in ${formatDuration(f.elapsedMs)}${c.status === 'cancelled' ? ' (what was stored is kept)' : ''}${c.error ? ` · ${c.error}` : ''}`;
  return (
    <Box component="section" aria-label={label} sx={{ display: 'flex', alignItems: 'center', gap: 1.5 }}>
      <Box sx={{ flex: 1, minWidth: 160 }}>
        <LinearProgress variant={f.total ? 'determinate' : 'indeterminate'} value={pct} aria-label={`${label} progress`} />
        <Typography variant="caption" role="status" className="mono">{text}</Typography>
      </Box>
      {active && onCancel && (
        <Button color="error" variant="outlined" size="small" onClick={onCancel} disabled={cancelling}>Cancel</Button>
      )}
    </Box>
  );
}
