import { LEDGER_BLOCK_SIZE, LEDGER_MAX_END } from '@cribra/contracts';
import { Alert, Box, Button, Paper, Stack, TextField, Typography } from '@mui/material';
import { type FormEvent, useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { ErrorState } from '../../../components/error-state';
import { LoadingState } from '../../../components/loading-state';
import { errorMessage } from '../../../lib/api-error';
import { groupDigits } from '../../../lib/format';
import { useCancelComputation } from '../api/cancel-computation';
import { isActive, useComputations } from '../api/list-computations';
import { ledgerKey, useLedgerBlocks } from '../api/list-ledger-blocks';
import { useRequestLedger } from '../api/request-ledger';
import { ESTIMATE_CONFIRM_MS } from '@cribra/contracts';
import { estimateLedgerMs } from '../lib/estimate';
import { ComputationProgress } from './computation-progress';
import { EstimateDialog } from './estimate-dialog';

const DIGITS = /^\d+$/;

/** A stored block [start, end) written as the range start..end − 1 (both ends included). */
function blockRange(b: { start: string | number; end: string | number }): string {
  return `${groupDigits(b.start)}..${groupDigits(BigInt(b.end) - 1n)}`;
}

/**
 * Which ranges of primes the ledger holds, and a form to extend it. Ranges read as everywhere in
 * Cribra: From..To with both ends included (the API's blocks are [start, end), so To + 1 is sent).
 */
export function LedgerSection() {
  const blocks = useLedgerBlocks(1);
  const request = useRequestLedger();
  const [from, setFrom] = useState('0');
  const [to, setTo] = useState(String(LEDGER_BLOCK_SIZE * 10 - 1));
  const [problem, setProblem] = useState<string>();
  const [confirm, setConfirm] = useState<{ from: string; to: string; ms: number } | null>(null);
  const computations = useComputations('ledger');
  const cancel = useCancelComputation();
  const qc = useQueryClient();
  // Computations started on this page, or still running when it opened: shown with their progress.
  const [followed, setFollowed] = useState<string[]>([]);
  const shown = (computations.data ?? []).filter((c) => isActive(c) || followed.includes(c.id));
  // Each block stored (and each computation ending) refreshes the ledger summary.
  const doneSum = shown.reduce((n, c) => n + c.chunksDone + (isActive(c) ? 0 : 1), 0);
  const lastSum = useRef(doneSum);
  useEffect(() => {
    if (doneSum !== lastSum.current) void qc.invalidateQueries({ queryKey: ledgerKey });
    lastSum.current = doneSum;
  }, [doneSum, qc]);

  const start = (f: string, t: string) => {
    setConfirm(null);
    request.mutate({ from: f, to: t }, { onSuccess: (c) => setFollowed((ids) => [c.id, ...ids]) });
  };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const f = from.replace(/[\s_]/g, '');
    const t = to.replace(/[\s_]/g, '');
    if (!DIGITS.test(f) || !DIGITS.test(t)) return setProblem('Write both ends as whole numbers.');
    if (BigInt(f) > BigInt(t)) return setProblem('The start must not be above the end.');
    if (BigInt(t) >= BigInt(LEDGER_MAX_END)) return setProblem(`The ledger ends below ${groupDigits(LEDGER_MAX_END)}.`);
    setProblem(undefined);
    // The API's ranges are [from, to): the included end To is sent as To + 1.
    const end = String(BigInt(t) + 1n);
    const w = BigInt(LEDGER_BLOCK_SIZE);
    const blocks = Number((BigInt(end) - 1n) / w - BigInt(f) / w) + 1;
    const ms = estimateLedgerMs(blocks);
    if (ms > ESTIMATE_CONFIRM_MS) setConfirm({ from: f, to: end, ms });
    else start(f, end);
  };

  return (
    <Box component="section" aria-labelledby="ledger-heading">
      <Typography id="ledger-heading" variant="h3" component="h2" sx={{ mb: 1 }}>Prime ledger</Typography>
      <Typography variant="body2" color="text.secondary" sx={{ mb: 1 }}>
        Statistics of the primes in blocks of {groupDigits(LEDGER_BLOCK_SIZE)}: counts, gaps, constellations, record gaps.
      </Typography>
      {blocks.isPending && <LoadingState label="Loading the ledger…" />}
      {blocks.isError && <ErrorState error={blocks.error} title="Could not load the ledger" onRetry={() => blocks.refetch()} />}
      {blocks.isSuccess && (
        <Paper sx={{ p: 1.5, mb: 2 }}>
          {blocks.data.total === 0 ? (
            <Typography>No block stored yet.</Typography>
          ) : (
            <Typography className="mono" variant="body2">
              {blocks.data.total} block{blocks.data.total === 1 ? '' : 's'} stored
              {blocks.data.items.length > 0 && ` · first ${blockRange(blocks.data.items[0])}`}
              {blocks.data.items.length > 1 && ` · last shown ${blockRange(blocks.data.items.at(-1)!)}`}
            </Typography>
          )}
        </Paper>
      )}
      <Stack component="form" direction="row" spacing={1} sx={{ alignItems: "flex-start" }} onSubmit={submit} noValidate aria-label="Extend the ledger">
        <TextField label="From" value={from} onChange={(e) => setFrom(e.target.value)} error={!!problem} helperText={problem ?? 'Widened to whole blocks.'} sx={{ maxWidth: 220 }} />
        <TextField label="To" value={to} onChange={(e) => setTo(e.target.value)} helperText="Both ends included." sx={{ maxWidth: 220 }} />
        <Button type="submit" variant="contained" disabled={request.isPending} sx={{ mt: 0.5 }}>Compute blocks</Button>
      </Stack>
      {request.isError && <Alert severity="error" sx={{ mt: 1 }}>{errorMessage(request.error)}</Alert>}
      {request.isSuccess && <Alert severity="success" role="status" sx={{ mt: 1 }}>Queued: {request.data.chunksTotal} block{request.data.chunksTotal === 1 ? '' : 's'} to compute.</Alert>}
      {cancel.isError && <Alert severity="error" sx={{ mt: 1 }}>{errorMessage(cancel.error)}</Alert>}
      <Stack spacing={1} sx={{ mt: 1 }}>
        {shown.map((c) => (
          <ComputationProgress key={c.id} computation={c} unit="block" label={`Ledger computation ${blockRange({ start: String(c.params.from), end: String(c.params.to) })}`}
            onCancel={() => cancel.mutate(c.id)} cancelling={cancel.isPending} />
        ))}
      </Stack>
      {confirm && (
        <EstimateDialog what={`The ledger range ${blockRange({ start: confirm.from, end: confirm.to })}`} estimateMs={confirm.ms}
          onConfirm={() => start(confirm.from, confirm.to)} onClose={() => setConfirm(null)} />
      )}
    </Box>
  );
}
