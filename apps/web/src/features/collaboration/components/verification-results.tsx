import type { VerificationCellStatus, VerificationView } from '@cribra/contracts';
import { Alert, Box, Chip, LinearProgress, Stack, Table, TableBody, TableCell, TableHead, TableRow, Typography } from '@mui/material';
import { Fragment } from 'react';
import { OutputView } from '../../../components/outputs/output-view';

const COLOUR: Record<VerificationCellStatus, 'default' | 'success' | 'error' | 'warning'> = {
  pending: 'default',
  same: 'success',
  differs: 'error',
  failed: 'error',
  skipped: 'default',
};

/** Per-cell outcome of a re-verify: same digest, differs (with both digests), failed, skipped. */
export function VerificationResults({ verification: v }: { verification: VerificationView }) {
  const running = v.status === 'running';
  const lock = v.purpose === 'lock';
  return (
    <Box aria-label={lock ? 'Re-check results' : 'Re-verify results'} component="section">
      {running && <LinearProgress aria-label={lock ? 'Re-checking' : 'Re-verifying'} sx={{ mb: 1 }} />}
      {running && lock && (
        <Typography variant="body2" role="status" sx={{ mb: 1 }}>
          {v.cells.length - v.counts.pending} of {v.cells.length} cells compared so far…
        </Typography>
      )}
      {!running && (
        <Alert severity={v.allSame ? 'success' : 'warning'} sx={{ mb: 1 }}>
          {lock
            ? `${v.counts.same} same, ${v.counts.differs} differ, ${v.counts.failed} failed${v.counts.skipped ? `, ${v.counts.skipped} note${v.counts.skipped === 1 ? '' : 's'} skipped` : ''}: ${
                v.allSame ? 'every cell gave the outputs in the lock record.' : 'the re-run does not match the lock record.'
              }`
            : v.allSame
              ? 'Every cell gave the same outputs as recorded.'
              : `${v.counts.differs} differ, ${v.counts.failed} failed: a sign-off needs every cell the same.`}
        </Alert>
      )}
      <Table size="small" aria-label={lock ? 'Cells re-checked' : 'Cells re-verified'}>
        <TableHead>
          <TableRow>
            <TableCell>Cell</TableCell>
            <TableCell>Result</TableCell>
            <TableCell>Digest</TableCell>
          </TableRow>
        </TableHead>
        <TableBody>
          {v.cells.map((c) => (
            <Fragment key={c.cellId}>
            <TableRow>
              <TableCell className="mono">{c.position + 1} {c.kind}</TableCell>
              <TableCell>
                <Chip size="small" label={c.status} color={COLOUR[c.status]} />
                {c.note && <Typography variant="caption" component="p">{c.note}</Typography>}
                {c.error && <Typography variant="caption" color="error" component="p">{c.error.message}</Typography>}
              </TableCell>
              <TableCell className="mono" sx={{ fontSize: 11 }}>
                {c.recordedDigest?.slice(0, 10) ?? '—'}{c.newDigest && c.newDigest !== c.recordedDigest ? ` → ${c.newDigest.slice(0, 10)}` : ''}
              </TableCell>
            </TableRow>
            {c.status === 'differs' && (c.recordedOutputs || c.newOutputs) && (
              <TableRow>
                <TableCell colSpan={3}>
                  <Box component="details">
                    <summary>Both outputs of cell {c.position + 1}</summary>
                    <Stack spacing={1} sx={{ mt: 1 }}>
                      <Typography variant="caption">Recorded</Typography>
                      {(c.recordedOutputs ?? []).map((o, i) => <OutputView key={`r${i}`} output={o} />)}
                      <Typography variant="caption">Re-run</Typography>
                      {(c.newOutputs ?? []).map((o, i) => <OutputView key={`n${i}`} output={o} />)}
                    </Stack>
                  </Box>
                </TableCell>
              </TableRow>
            )}
            </Fragment>
          ))}
        </TableBody>
      </Table>
    </Box>
  );
}
