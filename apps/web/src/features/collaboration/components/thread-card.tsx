import type { CommentThreadView, NotebookView } from '@cribra/contracts';
import { Box, Button, Paper, TextField, Typography } from '@mui/material';
import { useState } from 'react';
import { LazyNoteView } from '../../../components/note/lazy-note-view';
import { formatDateTime } from '../../../lib/format';

interface Props {
  thread: CommentThreadView;
  notebook: NotebookView;
  canWrite: boolean;
  onReply: (body: string) => void;
  onResolve: (resolved: boolean) => void;
}

function anchorText(thread: CommentThreadView, nb: NotebookView): string {
  if (thread.anchor.kind === 'notebook') return 'Whole notebook';
  const { cellId } = thread.anchor;
  const i = nb.cells.findIndex((c) => c.id === cellId);
  const where = i < 0 ? 'a removed cell' : `Cell ${i + 1}`;
  return thread.anchor.kind === 'output' ? `${where}, output ${thread.anchor.outputIndex + 1}` : where;
}

/** One comment thread: its place, the comments (Markdown with maths), reply and resolve. */
export function ThreadCard({ thread, notebook, canWrite, onReply, onResolve }: Props) {
  const [reply, setReply] = useState('');
  return (
    <Paper component="article" aria-label={`Thread on ${anchorText(thread, notebook)}`} sx={{ p: 1.5, opacity: thread.status === 'resolved' ? 0.7 : 1 }}>
      <Typography variant="caption" color="text.secondary">{anchorText(thread, notebook)} · {thread.status}</Typography>
      {thread.comments.map((c) => (
        <Box key={c.id} sx={{ mt: 1 }}>
          <Typography variant="body2" sx={{ fontWeight: 600 }}>{c.author.displayName} <Typography component="span" variant="caption" color="text.secondary">{formatDateTime(c.createdAt)}{c.editedAt ? ' · edited' : ''}</Typography></Typography>
          <LazyNoteView source={c.body} />
        </Box>
      ))}
      {canWrite && (
        <Box sx={{ display: 'flex', gap: 1, mt: 1, alignItems: 'flex-start' }}>
          {thread.status === 'open' && (
            <>
              <TextField label="Reply" value={reply} onChange={(e) => setReply(e.target.value)} multiline />
              <Button onClick={() => { if (reply.trim()) { onReply(reply.trim()); setReply(''); } }}>Send</Button>
            </>
          )}
          <Button onClick={() => onResolve(thread.status === 'open')}>{thread.status === 'open' ? 'Resolve' : 'Reopen'}</Button>
        </Box>
      )}
    </Paper>
  );
}
