import type { RunView } from '@cribra/contracts';
import { errorTitle } from '@cribra/lang';
import { Alert, Stack } from '@mui/material';
import { OutputView } from '../../../components/outputs/output-view';

/** The outputs of a finished run, or its error with the source position when there is one. */
export function RunOutputs({ run }: { run: RunView }) {
  if (run.status === 'failed' || run.status === 'cancelled') {
    const e = run.error;
    return (
      <Alert severity={run.status === 'cancelled' ? 'info' : 'error'} sx={{ my: 1 }}>
        <strong>{errorTitle(e?.kind ?? (run.status === 'cancelled' ? 'cancelled' : 'internal'))}</strong>
        {e?.line ? ` (line ${e.line}${e.column ? `, column ${e.column}` : ''})` : ''}: {e?.message ?? 'The run stopped.'}
      </Alert>
    );
  }
  if (!run.outputs?.length) return null;
  return (
    <Stack spacing={2} sx={{ my: 1 }}>
      {run.outputs.map((o, i) => <OutputView key={i} output={o} fileName={`run-${run.id.slice(0, 8)}-${i + 1}`} />)}
    </Stack>
  );
}
