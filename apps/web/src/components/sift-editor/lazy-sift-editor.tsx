import { Box, Skeleton } from '@mui/material';
import { lazy, Suspense } from 'react';
import type { SiftEditorProps } from './sift-editor';

const SiftEditor = lazy(() => import('./sift-editor'));

/** The Sift editor behind a lazy boundary: Monaco loads only on pages that edit cells. */
export function LazySiftEditor(props: SiftEditorProps) {
  return (
    <Suspense fallback={<Box aria-label="Loading the editor"><Skeleton variant="rectangular" height={80} /></Box>}>
      <SiftEditor {...props} />
    </Suspense>
  );
}
