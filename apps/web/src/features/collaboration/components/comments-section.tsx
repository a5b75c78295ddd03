import type { CommentAnchor, NotebookView } from '@cribra/contracts';
import { Alert, Button, MenuItem, Stack, TextField, Typography } from '@mui/material';
import { useState } from 'react';
import { LoadingState } from '../../../components/loading-state';
import { errorMessage } from '../../../lib/api-error';
import { useCommentActions } from '../api/comment-actions';
import { useThreads } from '../api/list-threads';
import { ThreadCard } from './thread-card';

/** Comment threads of the notebook, per cell or for the whole notebook, in the side panel. */
export function CommentsSection({ notebook, canWrite }: { notebook: NotebookView; canWrite: boolean }) {
  const threads = useThreads(notebook.id);
  const actions = useCommentActions(notebook.id);
  const [target, setTarget] = useState('notebook');
  const [body, setBody] = useState('');
  const error = actions.createThread.error ?? actions.addComment.error ?? actions.resolve.error;

  const start = () => {
    if (!body.trim()) return;
    const anchor: CommentAnchor = target === 'notebook' ? { kind: 'notebook' } : { kind: 'cell', cellId: target };
    actions.createThread.mutate({ anchor, body: body.trim() }, { onSuccess: () => setBody('') });
  };

  return (
    <Stack spacing={1.5}>
      <Typography variant="h4" component="h3">Comments</Typography>
      {error && <Alert severity="error">{errorMessage(error)}</Alert>}
      {threads.isPending && <LoadingState label="Loading comments…" />}
      {threads.isError && <Alert severity="error">{errorMessage(threads.error)}</Alert>}
      {threads.data?.length === 0 && <Typography color="text.secondary">No comments yet.</Typography>}
      {threads.data?.map((t) => (
        <ThreadCard key={t.id} thread={t} notebook={notebook} canWrite={canWrite}
          onReply={(b) => actions.addComment.mutate({ threadId: t.id, body: b })}
          onResolve={(resolved) => actions.resolve.mutate({ threadId: t.id, resolved })} />
      ))}
      {canWrite && (
        <Stack spacing={1} component="section" aria-label="New comment">
          <TextField select label="About" value={target} onChange={(e) => setTarget(e.target.value)}>
            <MenuItem value="notebook">The whole notebook</MenuItem>
            {notebook.cells.map((c, i) => <MenuItem key={c.id} value={c.id}>Cell {i + 1} ({c.kind})</MenuItem>)}
          </TextField>
          <TextField label="Comment" value={body} onChange={(e) => setBody(e.target.value)} multiline minRows={2} helperText="Markdown with $maths$." />
          <Button variant="outlined" onClick={start} disabled={actions.createThread.isPending || !body.trim()}>Start thread</Button>
        </Stack>
      )}
    </Stack>
  );
}
