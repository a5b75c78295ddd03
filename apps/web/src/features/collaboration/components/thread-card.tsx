import type { CommentThreadView, CreateCommentBody, NotebookView, UserRef } from '@cribra/contracts';
import { Box, Button, Paper, Typography } from '@mui/material';
import { useMentionDraft } from '../hooks/use-mention-draft';
import { CommentItem } from './comment-item';
import { MentionField } from './mention-field';

interface Props {
  thread: CommentThreadView;
  notebook: NotebookView;
  canWrite: boolean;
  /** The signed-in reader (their own comments can be edited). */
  userId?: string;
  /** People who can be mentioned. */
  members: UserRef[];
  /** Sends a reply; `sent` clears the box once the API took it. */
  onReply: (body: CreateCommentBody, sent: () => void) => void;
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
export function ThreadCard({ thread, notebook, canWrite, userId, members, onReply, onResolve }: Props) {
  const reply = useMentionDraft();
  const send = () => {
    const body = reply.text.trim();
    if (body) onReply({ body, mentions: reply.mentions(members) }, reply.reset);
  };
  return (
    <Paper component="article" aria-label={`Thread on ${anchorText(thread, notebook)}`} sx={{ p: 1.5, opacity: thread.status === 'resolved' ? 0.7 : 1 }}>
      <Typography variant="caption" color="text.secondary">{anchorText(thread, notebook)} · {thread.status}</Typography>
      {thread.comments.map((c) => (
        <CommentItem key={c.id} comment={c} notebookId={notebook.id} members={members} canEdit={canWrite && !!userId && c.author.id === userId} />
      ))}
      {canWrite && (
        <Box sx={{ display: 'flex', gap: 1, mt: 1, alignItems: 'flex-start' }}>
          {thread.status === 'open' && (
            <>
              <Box sx={{ flexGrow: 1 }}>
                <MentionField label="Reply" value={reply.text} onChange={reply.setText} members={members} onPick={reply.pick} />
              </Box>
              <Button onClick={send}>Send</Button>
            </>
          )}
          <Button onClick={() => onResolve(thread.status === 'open')}>{thread.status === 'open' ? 'Resolve' : 'Reopen'}</Button>
        </Box>
      )}
    </Paper>
  );
}
