import type { LockedCell, PublishedCell } from '@cribra/contracts';
import { Box, Chip, Paper, Stack, Typography } from '@mui/material';
import { LazyNoteView } from '../../../components/note/lazy-note-view';
import { OutputView } from '../../../components/outputs/output-view';
import { monoFont } from '../../../lib/design-tokens';
import { RecordFields } from './record-fields';

// Fields of a record cell this card shows in its own way (a claim's entry through its verdict output,
// the outputs' size and completeness through the outputs); any other field is listed below it.
const SHOWN = new Set([
  'id', 'position', 'kind', 'title', 'source', 'outputDigest', 'outputs', 'sourceSha256', 'runId', 'engineVersion', 'languageVersion',
  'cellRevision', 'uploadsRead', 'claims', 'outputsBytes', 'outputsComplete',
]);

/** One cell of a published record: kind and title, source, the recorded outputs and digests. */
export function RecordCell({ cell, locked }: { cell: PublishedCell; locked?: LockedCell }) {
  const extra = Object.fromEntries(Object.entries(locked ?? {}).filter(([k]) => !SHOWN.has(k)));
  return (
    <Paper variant="outlined" component="article" aria-label={`Cell ${cell.position + 1}`} sx={{ p: 2 }}>
      <Stack direction="row" spacing={1} sx={{ mb: 1, alignItems: "center" }}>
        <Chip size="small" label={cell.kind} />
        <Typography variant="h4" component="h3">{cell.title ?? `Cell ${cell.position + 1}`}</Typography>
      </Stack>
      {cell.kind === 'note' ? (
        <LazyNoteView source={cell.source} />
      ) : (
        <Box component="pre" sx={{ fontFamily: monoFont, fontSize: 13, m: 0, mb: 1.5, p: 1.5, bgcolor: 'background.default', borderRadius: 1, overflowX: 'auto', whiteSpace: 'pre-wrap' }}>
          {cell.source}
        </Box>
      )}
      {cell.outputs?.map((o, i) => (
        <Box key={i} sx={{ mb: 1 }}>
          <OutputView output={o} />
        </Box>
      ))}
      {cell.kind !== 'note' && (
        <Typography sx={{ fontFamily: monoFont, fontSize: 11, color: 'text.secondary', wordBreak: 'break-all' }}>
          output digest {cell.outputDigest ?? '—'}
          {locked?.engineVersion ? ` · engine ${locked.engineVersion}, Sift ${locked.languageVersion ?? '?'}` : ''}
          {locked?.cellRevision != null ? ` · cell revision ${locked.cellRevision}` : ''}
          {locked?.uploadsRead?.length ? ` · reads ${locked.uploadsRead.join(', ')}` : ''}
        </Typography>
      )}
      {Object.keys(extra).length > 0 && <RecordFields fields={extra} />}
    </Paper>
  );
}
