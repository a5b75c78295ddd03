import type { PublishedRecordView } from '@cribra/contracts';
import { Alert, AlertTitle, Box, Button, Divider, Link, Stack, Table, TableBody, TableCell, TableHead, TableRow, Typography } from '@mui/material';
import { useParams } from 'react-router-dom';
import { ErrorState } from '../../../components/error-state';
import { LoadingState } from '../../../components/loading-state';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { ApiRequestError } from '../../../lib/api-error';
import { monoFont } from '../../../lib/design-tokens';
import { formatDateTime } from '../../../lib/format';
import { useRecord } from '../api/get-record';
import { CitationBlock } from '../components/citation-block';
import { RecordCell } from '../components/record-cell';
import { RecordFields } from '../components/record-fields';

// Top-level fields of the lock record the page shows in its own sections; any other field is listed as it is.
const SHOWN = new Set([
  'notebookId', 'title', 'notebookRevision', 'revisionDigest', 'digestVersion', 'lockedBy', 'lockedAt', 'signers', 'requiredSignoffs', 'engineVersion', 'languageVersion', 'runEngineVersions', 'runLanguageVersions', 'cells',
  // v1 fields the page shows through the published view (summary, authors, uploads, hash)
  'summary', 'authors', 'uploads', 'recordSha256',
]);

const DOWNLOADS = [
  ['json', 'JSON record'],
  ['markdown', 'Markdown'],
  ['latex', 'LaTeX'],
  ['sift', '.sift notebook'],
] as const;

function Downloads({ r }: { r: PublishedRecordView }) {
  return (
    <Stack component="section" direction="row" spacing={1} useFlexGap sx={{ flexWrap: "wrap" }} aria-label="Downloads">
      {DOWNLOADS.map(([format, label]) => (
        <Button key={format} variant="outlined" size="small" href={`/api/records/${r.id}/export?format=${format}`} download>{label}</Button>
      ))}
    </Stack>
  );
}

function Record({ r }: { r: PublishedRecordView }) {
  useDocumentTitle(r.title);
  const extra = Object.fromEntries(Object.entries(r.record).filter(([k]) => !SHOWN.has(k)));
  return (
    <Stack spacing={3}>
      {r.withdrawal && (
        <Alert severity="warning" variant="filled" role="alert" data-testid="withdrawn-banner">
          <AlertTitle>Withdrawn</AlertTitle>
          Withdrawn by {r.withdrawal.by.displayName} on {formatDateTime(r.withdrawal.at)}: {r.withdrawal.reason}
          <br />The record below is kept as it was published.
        </Alert>
      )}
      <Box component="header">
        <Typography sx={{ fontFamily: monoFont, fontSize: 12, color: 'text.secondary' }}>Published record · {r.url}</Typography>
        <Typography variant="h1" gutterBottom>{r.title}</Typography>
        <Typography>{r.authors.map((a) => a.displayName).join(', ')}</Typography>
        {r.summary && <Typography color="text.secondary" sx={{ mt: 1 }}>{r.summary}</Typography>}
      </Box>
      <Box component="section" aria-label="About this record">
        <Typography variant="body2">
          Locked by {r.record.lockedBy.displayName} on {formatDateTime(r.record.lockedAt)} at revision {r.record.notebookRevision}; published {formatDateTime(r.publishedAt)}.
          Engine {r.record.engineVersion}, Sift {r.record.languageVersion}.
        </Typography>
        <Typography sx={{ fontFamily: monoFont, fontSize: 12, wordBreak: 'break-all', mt: 1 }}>record SHA-256 {r.recordSha256}</Typography>
        <Typography sx={{ fontFamily: monoFont, fontSize: 12, wordBreak: 'break-all' }}>revision digest ({r.record.digestVersion}) {r.record.revisionDigest}</Typography>
        <Typography variant="body2" sx={{ fontStyle: 'italic', mt: 1 }}>
          Computed evidence is not a proof: each claim holds only over the range it states.
        </Typography>
      </Box>
      <Downloads r={r} />
      <Box component="section" aria-label="Reviewers">
        <Typography variant="h3" component="h2" gutterBottom>Reviewers</Typography>
        {r.record.signers.length === 0 && <Typography variant="body2">No sign-offs are recorded.</Typography>}
        {r.record.signers.map((s) => (
          <Box key={s.reviewId} sx={{ mb: 1 }}>
            <Typography variant="body2"><strong>{s.user.displayName}</strong> signed off on {formatDateTime(s.signedAt)}</Typography>
            {s.comment.trim() && <Typography variant="body2" color="text.secondary">{s.comment}</Typography>}
          </Box>
        ))}
      </Box>
      <Stack component="section" aria-label="Cells" spacing={2}>
        {r.cells.map((c) => (
          <RecordCell key={c.id} cell={c} locked={r.record.cells.find((x) => x.id === c.id)} />
        ))}
      </Stack>
      {r.uploads.length > 0 && (
        <Box component="section" aria-label="Uploads">
          <Typography variant="h3" component="h2" gutterBottom>Uploads</Typography>
          <Table size="small">
            <TableHead>
              <TableRow><TableCell>name</TableCell><TableCell>type</TableCell><TableCell align="right">bytes</TableCell><TableCell>SHA-256</TableCell></TableRow>
            </TableHead>
            <TableBody>
              {r.uploads.map((u) => (
                <TableRow key={u.name}>
                  <TableCell><Link href={`/api/records/${r.id}/uploads/${encodeURIComponent(u.name)}`} download>{u.name}</Link></TableCell>
                  <TableCell>{u.mediaType}</TableCell>
                  <TableCell align="right" sx={{ fontFamily: monoFont }}>{u.sizeBytes}</TableCell>
                  <TableCell sx={{ fontFamily: monoFont, fontSize: 11, wordBreak: 'break-all' }}>{u.sha256}</TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
        </Box>
      )}
      <RecordFields fields={extra} title="More of the record" />
      <Divider />
      <CitationBlock citation={r.citation} verifyCommand={r.verifyCommand} />
    </Stack>
  );
}

/** `/records/:id`: a published record, readable without signing in. */
export default function RecordPage() {
  const { id = '' } = useParams();
  const record = useRecord(id);
  let body;
  if (record.isPending) body = <LoadingState label="Loading the record…" />;
  else if (record.isError) {
    const missing = record.error instanceof ApiRequestError && record.error.statusCode === 404;
    body = missing ? (
      <Box>
        <Typography variant="h1" gutterBottom>No published record here</Typography>
        <Typography color="text.secondary">There is no published record at this address.</Typography>
      </Box>
    ) : (
      <ErrorState error={record.error} onRetry={() => void record.refetch()} />
    );
  } else body = <Record r={record.data} />;
  return (
    <Box component="main" sx={{ maxWidth: 960, mx: 'auto', py: 4, px: 2 }}>
      {body}
    </Box>
  );
}
