import type { CommentAnchor, NotebookView, UserRef } from '@cribra/contracts';
import { Alert, Button, MenuItem, Stack, TextField, Typography } from '@mui/material';
import { useMemo, useState } from 'react';
import { LoadingState } from '../../../components/loading-state';
import { errorMessage } from '../../../lib/api-error';
import { useCurrentUser } from '../../../lib/current-user';
import { useCommentActions } from '../api/comment-actions';
import { useThreads } from '../api/list-threads';
import { useMentionDraft } from '../hooks/use-mention-draft';
import { MentionField } from './mention-field';
import { ThreadCard } from './thread-card';

// The "About" choice as one string: 'notebook', a cell id, or output/<cell>/<run>/<index>.
const outputTarget = (cellId: string, runId: string, index: number): string => `output/${cellId}/${runId}/${index}`;

function anchorOf(target: string): CommentAnchor {
  if (target === 'notebook') return { kind: 'notebook' };
  const [head, cellId, runId, index] = target.split('/');
  if (head === 'output') return { kind: 'output', cellId: cellId!, runId: runId!, outputIndex: Number(index) };
  return { kind: 'cell', cellId: target };
}

/** Comment threads of the notebook, per cell, per output of a cell's latest run or for the whole notebook, in the side panel. */
export function CommentsSection({ notebook, canWrite }: { notebook: NotebookView; canWrite: boolean }) {
  const threads = useThreads(notebook.id);
  const actions = useCommentActions(notebook.id);
  const me = useCurrentUser();
  const members = useMemo<UserRef[]>(() => notebook.members.map((m) => ({ id: m.userId, displayName: m.displayName })), [notebook.members]);
  const [target, setTarget] = useState('notebook');
  const draft = useMentionDraft();
  const error = actions.createThread.error ?? actions.addComment.error ?? actions.resolve.error;

  const start = () => {
    const body = draft.text.trim();
    if (!body) return;
    const anchor = anchorOf(target);
    actions.createThread.mutate({ anchor, body, mentions: draft.mentions(members) }, { onSuccess: draft.reset });
  };

  return (
    <Stack spacing={1.5}>
      <Typography variant="h4" component="h3">Comments</Typography>
      {error && <Alert severity="error">{errorMessage(error)}</Alert>}
      {threads.isPending && <LoadingState label="Loading comments…" />}
      {threads.isError && <Alert severity="error">{errorMessage(threads.error)}</Alert>}
      {threads.data?.length === 0 && <Typography color="text.secondary">No comments yet.</Typography>}
      {threads.data?.map((t) => (
        <ThreadCard key={t.id} thread={t} notebook={notebook} canWrite={canWrite} userId={me.data?.id} members={members}
          // Per reply, not per mutation: mutate's own onSuccess fires only for the latest call, so
          // a reply sent while another was under way would keep its text after being accepted.
          onReply={(b, sent) => void actions.addComment.mutateAsync({ threadId: t.id, ...b }).then(sent, () => undefined)}
          onResolve={(resolved) => actions.resolve.mutate({ threadId: t.id, resolved })} />
      ))}
      {canWrite && (
        <Stack spacing={1} component="section" aria-label="New comment">
          <TextField select label="About" value={target} onChange={(e) => setTarget(e.target.value)}>
            <MenuItem value="notebook">The whole notebook</MenuItem>
            {notebook.cells.flatMap((c, i) => [
              <MenuItem key={c.id} value={c.id}>Cell {i + 1} ({c.kind})</MenuItem>,
              ...(c.latestRun?.outputs ?? []).map((o, j) => (
                <MenuItem key={`${c.id}/${j}`} value={outputTarget(c.id, c.latestRun!.id, j)} sx={{ pl: 4 }}>
                  Cell {i + 1}, output {j + 1} ({o.kind})
                </MenuItem>
              )),
            ])}
          </TextField>
          <MentionField label="Comment" value={draft.text} onChange={draft.setText} members={members} onPick={draft.pick} minRows={2}
            helperText="Markdown with $maths$. Type @ to mention a member." />
          <Button variant="outlined" onClick={start} disabled={actions.createThread.isPending || !draft.text.trim()}>Start thread</Button>
        </Stack>
      )}
    </Stack>
  );
}
