import type { CommentView, UserRef } from '@cribra/contracts';
import { Box, Button, Typography } from '@mui/material';
import { useState } from 'react';
import { LazyNoteView } from '../../../components/note/lazy-note-view';
import { formatDateTime } from '../../../lib/format';
import { CommentEditForm } from './comment-edit-form';

interface Props {
  comment: CommentView;
  notebookId: string;
  members: UserRef[];
  /** The reader wrote this comment and may still write comments here. */
  canEdit: boolean;
}

/** One comment: author, time, "edited" time, the sanitised text with mentions highlighted; Edit for its author. */
export function CommentItem({ comment, notebookId, members, canEdit }: Props) {
  const [editing, setEditing] = useState(false);
  const c = comment;
  return (
    <Box component="section" aria-label={`Comment by ${c.author.displayName}`} sx={{ mt: 1 }}>
      <Box sx={{ display: 'flex', alignItems: 'baseline', gap: 1 }}>
        <Typography variant="body2" sx={{ fontWeight: 600, flexGrow: 1 }}>
          {c.author.displayName}{' '}
          <Typography component="span" variant="caption" color="text.secondary">
            {formatDateTime(c.createdAt)}
            {c.editedAt && ` · edited ${formatDateTime(c.editedAt)}`}
          </Typography>
        </Typography>
        {canEdit && !editing && <Button size="small" onClick={() => setEditing(true)}>Edit</Button>}
      </Box>
      {editing ? (
        <CommentEditForm comment={c} notebookId={notebookId} members={members} onDone={() => setEditing(false)} />
      ) : (
        <LazyNoteView source={c.body} mentions={c.mentions.map((m) => m.displayName)} />
      )}
    </Box>
  );
}
