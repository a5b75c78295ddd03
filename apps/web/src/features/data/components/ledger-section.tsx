import { LEDGER_BLOCK_SIZE, LEDGER_MAX_END } from '@cribra/contracts';
import { Alert, Box, Button, Paper, Stack, TextField, Typography } from '@mui/material';
import { type FormEvent, useState } from 'react';
import { ErrorState } from '../../../components/error-state';
import { LoadingState } from '../../../components/loading-state';
import { errorMessage } from '../../../lib/api-error';
import { groupDigits } from '../../../lib/format';
import { useLedgerBlocks } from '../api/list-ledger-blocks';
import { useRequestLedger } from '../api/request-ledger';

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

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const f = from.replace(/[\s_]/g, '');
    const t = to.replace(/[\s_]/g, '');
    if (!DIGITS.test(f) || !DIGITS.test(t)) return setProblem('Write both ends as whole numbers.');
    if (BigInt(f) > BigInt(t)) return setProblem('The start must not be above the end.');
    if (BigInt(t) >= BigInt(LEDGER_MAX_END)) return setProblem(`The ledger ends below ${groupDigits(LEDGER_MAX_END)}.`);
    setProblem(undefined);
    request.mutate({ from: f, to: String(BigInt(t) + 1n) });
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
    </Box>
  );
}
