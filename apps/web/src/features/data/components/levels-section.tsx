import type { WheelLevelSummary } from '@cribra/contracts';
import { Alert, Box, Button, LinearProgress, Paper, Table, TableBody, TableCell, TableHead, TableRow, Typography } from '@mui/material';
import { EmptyState } from '../../../components/empty-state';
import { ErrorState } from '../../../components/error-state';
import { LoadingState } from '../../../components/loading-state';
import { errorMessage } from '../../../lib/api-error';
import { groupDigits } from '../../../lib/format';
import { ESTIMATE_CONFIRM_MS } from '@cribra/contracts';
import { useState } from 'react';
import { useCancelComputation } from '../api/cancel-computation';
import { useComputations } from '../api/list-computations';
import { useLevels } from '../api/list-levels';
import { useRequestLevel } from '../api/request-level';
import { levelPlan } from '../lib/level-plan';
import { estimateLevelMs } from '../lib/estimate';
import { nextLevelPrime } from '../lib/next-level';
import { ComputationProgress } from './computation-progress';
import { EstimateDialog } from './estimate-dialog';

const inProgress = (l: WheelLevelSummary) => l.status === 'computing' || l.status === 'pending';

function Progress({ level }: { level: WheelLevelSummary }) {
  if (!inProgress(level)) return <>{level.status}</>;
  const pct = level.chunksTotal ? Math.round((100 * level.chunksDone) / level.chunksTotal) : 0;
  return (
    <Box sx={{ minWidth: 120 }}>
      <LinearProgress variant={level.chunksTotal ? 'determinate' : 'indeterminate'} value={pct} aria-label={`Level ${level.prime} progress`} />
      <Typography variant="caption">{level.chunksDone} of {level.chunksTotal || '?'} chunks</Typography>
    </Box>
  );
}

interface Props {
  selected: number | null;
  onSelect: (prime: number) => void;
}

export function LevelsSection({ selected, onSelect }: Props) {
  const levels = useLevels();
  const request = useRequestLevel();
  const computations = useComputations('level');
  const cancel = useCancelComputation();
  const [confirm, setConfirm] = useState<number | null>(null);
  if (levels.isPending) return <LoadingState label="Loading wheel levels…" />;
  if (levels.isError) return <ErrorState error={levels.error} title="Could not load wheel levels" onRetry={() => levels.refetch()} />;
  const next = nextLevelPrime(levels.data);
  const plan = levelPlan(next);
  // One level at a time: the next level builds on the ones below it, so it waits for a running one.
  const running = levels.data.find(inProgress);
  const runningComputation = running && computations.data?.find((c) => c.id === running.computationId);
  const ask = () => {
    const ms = estimateLevelMs(next);
    if (ms > ESTIMATE_CONFIRM_MS) setConfirm(next);
    else request.mutate(next);
  };
  return (
    <Box component="section" aria-labelledby="levels-heading">
      <Box sx={{ display: 'flex', alignItems: 'center', mb: 1, gap: 2 }}>
        <Typography id="levels-heading" variant="h3" component="h2" sx={{ flex: 1 }}>Stored wheel levels</Typography>
        {running ? (
          <Typography variant="body2" role="status">Level {running.prime} is being computed; level {next} builds on it and can be asked for once it is stored.</Typography>
        ) : plan ? (
          <Button variant="contained" onClick={ask} disabled={request.isPending}>Compute level {next}</Button>
        ) : (
          <Typography variant="body2">Every level the runners compute (to 47) has been asked for.</Typography>
        )}
      </Box>
      {plan && <Typography variant="caption" component="p" sx={{ mb: 1 }}>{plan}</Typography>}
      {request.isError && <Alert severity="error" sx={{ mb: 1 }}>{errorMessage(request.error)}</Alert>}
      {cancel.isError && <Alert severity="error" sx={{ mb: 1 }}>{errorMessage(cancel.error)}</Alert>}
      {runningComputation && (
        <Box sx={{ mb: 1 }}>
          <ComputationProgress computation={runningComputation} unit="chunk" label={`Level ${running.prime} computation`}
            onCancel={() => cancel.mutate(runningComputation.id)} cancelling={cancel.isPending} />
        </Box>
      )}
      {confirm !== null && (
        <EstimateDialog what={`Wheel level ${confirm}`} estimateMs={estimateLevelMs(confirm)}
          onConfirm={() => { request.mutate(confirm); setConfirm(null); }} onClose={() => setConfirm(null)} />
      )}
      {levels.data.length === 0 ? (
        <EmptyState title="No wheel level stored yet">Ask for level 2 to start; each level p holds the reduced residue system modulo p#.</EmptyState>
      ) : (
        <Paper sx={{ overflowX: 'auto' }}>
          <Table size="small" aria-label="Wheel levels">
            <TableHead>
              <TableRow>
                <TableCell align="right">p</TableCell>
                <TableCell align="right">p#</TableCell>
                <TableCell align="right">φ(p#)</TableCell>
                <TableCell align="right">largest gap</TableCell>
                <TableCell>status</TableCell>
                <TableCell />
              </TableRow>
            </TableHead>
            <TableBody>
              {levels.data.map((l) => (
                <TableRow key={l.prime} selected={selected === l.prime} hover>
                  <TableCell align="right" className="mono">{l.prime}</TableCell>
                  <TableCell align="right" className="mono">{groupDigits(l.modulus)}</TableCell>
                  <TableCell align="right" className="mono">{groupDigits(l.phi)}</TableCell>
                  <TableCell align="right" className="mono">{l.largestGap ?? '—'}</TableCell>
                  <TableCell><Progress level={l} /></TableCell>
                  <TableCell>
                    <Button onClick={() => onSelect(l.prime)} disabled={l.status !== 'stored'}>Show level {l.prime}</Button>
                  </TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
        </Paper>
      )}
    </Box>
  );
}
