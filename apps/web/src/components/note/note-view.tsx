import 'katex/dist/katex.min.css';
import { Box } from '@mui/material';
import { useMemo } from 'react';
import { renderNote } from './render-note';

/**
 * A note cell as a page of text: Markdown with KaTeX maths, sanitised. Loaded only with the notebook page.
 * `mentions`: display names highlighted where the text says `@Name` (comments).
 */
export default function NoteView({ source, mentions }: { source: string; mentions?: string[] }) {
  const mentionKey = JSON.stringify(mentions ?? []);
  const html = useMemo(() => renderNote(source, JSON.parse(mentionKey) as string[]), [source, mentionKey]);
  return (
    <Box
      className="note-view"
      sx={{
        lineHeight: 1.6,
        '& h1, & h2, & h3': { fontSize: '1.1rem', fontWeight: 600, mt: 1, mb: 0.5 },
        '& p': { my: 0.75 },
        '& code': { fontSize: '0.92em', bgcolor: 'rgba(30,35,40,0.05)', px: 0.5, borderRadius: 0.5 },
        '& .note-math': { overflowX: 'auto', my: 1 },
        '& table': { borderCollapse: 'collapse' },
        '& td, & th': { border: 1, borderColor: 'divider', px: 1 },
        '& .mention': { color: 'primary.dark', bgcolor: 'action.selected', fontWeight: 600, px: 0.25, borderRadius: 0.5 },
      }}
      dangerouslySetInnerHTML={{ __html: html }}
    />
  );
}
