import { RECORDS_PATH } from '@cribra/contracts';
import { Alert, Box, Button, Link, Stack, TextField, Typography } from '@mui/material';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { errorMessage } from '../../../lib/api-error';
import { monoFont } from '../../../lib/design-tokens';
import { formatDateTime } from '../../../lib/format';
import { usePublication, usePublishRecord, useWithdrawRecord } from '../api/publication';

/**
 * Publishing a locked notebook's record: its public address once published; the owner (and admins)
 * may publish it, and withdraw it with a reason (it stays readable under a banner).
 */
export function PublishSection({ notebookId, canPublish }: { notebookId: string; canPublish: boolean }) {
  const publication = usePublication(notebookId);
  const publish = usePublishRecord(notebookId);
  const withdraw = useWithdrawRecord(notebookId);
  const [reason, setReason] = useState('');
  const [withdrawing, setWithdrawing] = useState(false);
  const p = publication.data;
  const error = publish.error ?? withdraw.error ?? publication.error;
  return (
    <Box component="section" aria-label="Publication" sx={{ mt: 2 }}>
      <Typography variant="h4" component="h3">Publication</Typography>
      {error && <Alert severity="error" sx={{ my: 1 }}>{errorMessage(error)}</Alert>}
      {p === null && (
        <Stack spacing={1} sx={{ mt: 0.5 }}>
          <Typography variant="body2">Not published. A published record gets a permanent public address anyone can read and cite; it never changes.</Typography>
          {canPublish && (
            <Box><Button variant="contained" onClick={() => publish.mutate()} disabled={publish.isPending}>Publish record</Button></Box>
          )}
        </Stack>
      )}
      {p && (
        <Stack spacing={1} sx={{ mt: 0.5 }}>
          <Typography variant="body2">
            Published {formatDateTime(p.publishedAt)} at{' '}
            <Link component={RouterLink} to={`${RECORDS_PATH}/${p.id}`} sx={{ fontFamily: monoFont, wordBreak: 'break-all' }}>{p.url}</Link>
          </Typography>
          {p.withdrawal && <Alert severity="warning">Withdrawn {formatDateTime(p.withdrawal.at)}: {p.withdrawal.reason}</Alert>}
          {canPublish && !p.withdrawal && !withdrawing && (
            <Box><Button variant="outlined" color="warning" onClick={() => setWithdrawing(true)}>Withdraw…</Button></Box>
          )}
          {withdrawing && !p.withdrawal && (
            <Stack spacing={1}>
              <TextField label="Reason (shown on the record)" value={reason} onChange={(e) => setReason(e.target.value)} multiline minRows={2} size="small" />
              <Stack direction="row" spacing={1}>
                <Button variant="contained" color="warning" disabled={!reason.trim() || withdraw.isPending} onClick={() => withdraw.mutate(reason.trim(), { onSuccess: () => setWithdrawing(false) })}>
                  Withdraw record
                </Button>
                <Button onClick={() => setWithdrawing(false)}>Cancel</Button>
              </Stack>
            </Stack>
          )}
        </Stack>
      )}
    </Box>
  );
}
