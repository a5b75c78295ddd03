import type { NotebookView } from '@cribra/contracts';
import { Alert, Button, Dialog, DialogActions, DialogContent, DialogTitle, Stack, TextField } from '@mui/material';
import { type FormEvent, useState } from 'react';
import { errorMessage } from '../../../lib/api-error';
import { useCreateNotebook } from '../api/create-notebook';
import { parseTagInput, tagProblem } from '../lib/notebook-settings';

interface Props {
  open: boolean;
  onClose: () => void;
  onCreated: (nb: NotebookView) => void;
}

export function CreateNotebookDialog({ open, onClose, onCreated }: Props) {
  const [title, setTitle] = useState('');
  const [summary, setSummary] = useState('');
  const [tags, setTags] = useState('');
  const [problem, setProblem] = useState<string>();
  const [tagsProblem, setTagsProblem] = useState<string>();
  const create = useCreateNotebook();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const badTags = tagProblem(parseTagInput(tags));
    setTagsProblem(badTags);
    if (!title.trim()) return setProblem('Give the notebook a title.');
    setProblem(undefined);
    if (badTags) return;
    create.mutate({ title: title.trim(), summary: summary.trim(), tags: parseTagInput(tags) }, { onSuccess: onCreated });
  };

  return (
    <Dialog open={open} onClose={onClose} fullWidth maxWidth="sm" aria-labelledby="create-notebook-title">
      <form onSubmit={submit} noValidate>
        <DialogTitle id="create-notebook-title">New notebook</DialogTitle>
        <DialogContent>
          <Stack spacing={2} sx={{ pt: 1 }}>
            {create.isError && <Alert severity="error">{errorMessage(create.error)}</Alert>}
            <TextField label="Title" value={title} onChange={(e) => setTitle(e.target.value)} error={!!problem} helperText={problem} autoFocus />
            <TextField label="Summary" value={summary} onChange={(e) => setSummary(e.target.value)} multiline minRows={2}
              helperText="What question the notebook tests." />
            <TextField label="Tags" value={tags} onChange={(e) => setTags(e.target.value)} error={!!tagsProblem}
              helperText={tagsProblem ?? 'Separated by commas or spaces, e.g. twin-primes, wheel'} />
          </Stack>
        </DialogContent>
        <DialogActions>
          <Button onClick={onClose}>Cancel</Button>
          <Button type="submit" variant="contained" disabled={create.isPending}>Create notebook</Button>
        </DialogActions>
      </form>
    </Dialog>
  );
}
