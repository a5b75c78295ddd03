import { Skeleton } from '@mui/material';
import { lazy, Suspense } from 'react';

const NoteView = lazy(() => import('./note-view'));

/** Markdown + KaTeX behind a lazy boundary (KaTeX and its fonts load only where notes are shown). */
export function LazyNoteView({ source, mentions }: { source: string; mentions?: string[] }) {
  return (
    <Suspense fallback={<Skeleton variant="text" />}>
      <NoteView source={source} mentions={mentions} />
    </Suspense>
  );
}
