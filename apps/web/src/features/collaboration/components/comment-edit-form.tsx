import type { CommentView, UserRef } from '@cribra/contracts';
import { Alert, Box, Button, Stack } from '@mui/material';
import { type FormEvent, useState } from 'react';
import { ApiRequestError, errorMessage } from '../../../lib/api-error';
import { useEditComment } from '../api/edit-comment';
import { useMentionDraft } from '../hooks/use-mention-draft';
import { MentionField } from './mention-field';

interface Props {
  comment: CommentView;
  notebookId: string;
  members: UserRef[];
  onDone: () => void;
}

/** What a refused edit says: the body's own message beside the box, everything else above it. */
function problemsOf(err: unknown): { body?: string; other?: string } {
  if (err instanceof ApiRequestError && err.statusCode === 400) {
    const { body, ...rest } = err.fieldErrors;
    const other = Object.entries(rest).map(([field, msg]) => `${field}: ${msg}`);
    return { body, other: other.length ? other.join('; ') : body ? undefined : err.message };
  }
  if (err instanceof ApiRequestError && err.statusCode === 404) return { other: 'This comment no longer exists.' };
  return { other: errorMessage(err) };
}

/** In-place editor of one's own comment; the text stays as typed when the API refuses it. */
export function CommentEditForm({ comment, notebookId, members, onDone }: Props) {
  const draft = useMentionDraft(comment.body, comment.mentions.map((m) => m.id));
  const edit = useEditComment(notebookId, comment.id);
  const [problems, setProblems] = useState<{ body?: string; other?: string }>({});
  const text = draft.text.trim();

  const save = (e: FormEvent) => {
    e.preventDefault();
    if (!text) return;
    if (draft.text === comment.body) return onDone();
    setProblems({});
    edit.mutate({ body: text, mentions: draft.mentions(members) }, { onSuccess: onDone, onError: (err) => setProblems(problemsOf(err)) });
  };

  return (
    <Stack component="form" spacing={1} sx={{ mt: 0.5 }} noValidate onSubmit={save} aria-label="Edit comment">
      {problems.other && <Alert severity="error">{problems.other}</Alert>}
      <MentionField
        label="Edit comment"
        value={draft.text}
        onChange={(v) => {
          draft.setText(v);
          if (problems.body) setProblems((p) => ({ ...p, body: undefined }));
        }}
        members={members}
        onPick={draft.pick}
        error={!!problems.body}
        helperText={problems.body ?? 'Markdown with $maths$. Type @ to mention a member.'}
        minRows={2}
        autoFocus
      />
      <Box sx={{ display: 'flex', gap: 1 }}>
        <Button type="submit" variant="contained" size="small" disabled={edit.isPending || !text}>Save</Button>
        <Button size="small" onClick={onDone} disabled={edit.isPending}>Cancel</Button>
      </Box>
    </Stack>
  );
}
