import { Box, Skeleton } from '@mui/material';
import { lazy, Suspense } from 'react';
import type { SiftDiffEditorProps } from './sift-diff-editor';

const SiftDiffEditor = lazy(() => import('./sift-diff-editor'));

/** The diff editor behind a lazy boundary: it loads only when a conflict is shown. */
export function LazySiftDiffEditor(props: SiftDiffEditorProps) {
  return (
    <Suspense fallback={<Box aria-label="Loading the comparison"><Skeleton variant="rectangular" height={120} /></Box>}>
      <SiftDiffEditor {...props} />
    </Suspense>
  );
}
