import type { CellView } from '@cribra/contracts';
import { Alert, Box, Button, Stack, Typography } from '@mui/material';
import { useRef } from 'react';
import { LazySiftDiffEditor } from '../../../components/sift-editor/lazy-sift-diff-editor';

interface Props {
  mine: string;
  theirs: CellView;
  /** The revision the unsaved text started from. */
  baseRevision: number;
  language?: string;
  saving: boolean;
  onKeepMine: () => void;
  onTakeTheirs: () => void;
  onSaveMerge: (text: string) => void;
}

/**
 * A save that met a newer revision, shown beside the cell (not in a dialog, so the rest of the
 * notebook stays readable): the saved text on the left, the author's on the right, editable as
 * the merge. Nothing is saved until the author chooses.
 */
export function CellConflict({ mine, theirs, baseRevision, language, saving, onKeepMine, onTakeTheirs, onSaveMerge }: Props) {
  const readMerged = useRef<() => string>(() => mine);
  return (
    <Box component="section" aria-label="Conflicting edits" sx={{ mt: 1 }}>
      <Alert severity="warning" sx={{ mb: 1 }}>
        {theirs.author.displayName} saved revision {theirs.revision} while you were editing revision {baseRevision}. Nothing
        was overwritten: choose what the cell keeps, or edit the right-hand side into a merge of both.
      </Alert>
      <Box sx={{ display: 'flex', gap: 1, mb: 0.5 }}>
        <Typography variant="caption" sx={{ flex: 1, fontWeight: 600 }}>Saved (rev {theirs.revision}, {theirs.author.displayName})</Typography>
        <Typography variant="caption" sx={{ flex: 1, fontWeight: 600 }}>Yours (not saved) — editable</Typography>
      </Box>
      <LazySiftDiffEditor
        original={theirs.source}
        modified={mine}
        language={language}
        path={`conflict-${theirs.id}-${theirs.revision}`}
        originalLabel={`Saved text, revision ${theirs.revision}`}
        modifiedLabel="Your text (edit it into the merge)"
        onReady={(read) => (readMerged.current = read)}
      />
      <Stack direction="row" spacing={1} sx={{ mt: 1 }}>
        <Button variant="contained" disabled={saving} onClick={() => onSaveMerge(readMerged.current())}>Save merge</Button>
        <Button variant="outlined" disabled={saving} onClick={onKeepMine}>Keep mine</Button>
        <Button variant="outlined" disabled={saving} onClick={onTakeTheirs}>Take theirs</Button>
      </Stack>
    </Box>
  );
}
