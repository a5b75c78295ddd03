import type { NotebookSummary } from '@cribra/contracts';
import { Alert, Button, Dialog, DialogActions, DialogContent, DialogTitle, Stack, TextField } from '@mui/material';
import { type FormEvent, useState } from 'react';
import { ApiRequestError, errorMessage } from '../../../lib/api-error';
import { lockedNotebook, staleNotebook, useUpdateNotebook } from '../api/update-notebook';
import {
  formFieldOf,
  type NotebookSettingsField,
  type NotebookSettingsForm,
  type NotebookSettingsProblems,
  settingsChanges,
  settingsFormOf,
  settingsProblems,
  SIGNOFFS_MAX,
  SIGNOFFS_MIN,
} from '../lib/notebook-settings';

interface Props {
  /** The notebook as it was when the dialog opened; its revision is the one the edit starts from. */
  notebook: NotebookSummary;
  onClose: () => void;
}

const sameSettings = (a: NotebookSettingsForm, b: NotebookSettingsForm): boolean =>
  (Object.keys(a) as NotebookSettingsField[]).every((k) => a[k] === b[k]);

/** Title, summary, tags and required sign-offs of a notebook. Mount it to open it (the form starts from `notebook`). */
export function NotebookSettingsDialog({ notebook, onClose }: Props) {
  const [start] = useState(() => settingsFormOf(notebook));
  const [form, setForm] = useState<NotebookSettingsForm>(start);
  const [revision, setRevision] = useState(notebook.revision);
  const [problems, setProblems] = useState<NotebookSettingsProblems>({});
  const [conflict, setConflict] = useState<NotebookSummary | null>(null);
  const [failure, setFailure] = useState<string>();
  const update = useUpdateNotebook(notebook.id);
  const [lockedMeanwhile, setLockedMeanwhile] = useState(false);
  const locked = lockedMeanwhile || conflict?.status === 'locked';

  const edit = (field: NotebookSettingsField) => (e: { target: { value: string } }) => {
    setForm((f) => ({ ...f, [field]: e.target.value }));
    setProblems((p) => ({ ...p, [field]: undefined }));
  };

  const save = (fromRevision: number, quietRetries = 3) => {
    const found = settingsProblems(form);
    setProblems(found);
    setFailure(undefined);
    if (Object.values(found).some(Boolean)) return;
    const body = settingsChanges(start, form, fromRevision);
    if (Object.keys(body).length === 1) return onClose(); // nothing changed
    update.mutate(body, {
      onSuccess: onClose,
      onError: (err) => {
        const current = staleNotebook(err);
        // The revision also moves with cell edits and runs: when none of these settings changed
        // meanwhile there is nothing to decide, so the same changes go onto the current revision.
        if (current && current.status !== 'locked' && quietRetries > 0 && sameSettings(settingsFormOf(current), start)) {
          setRevision(current.revision);
          return save(current.revision, quietRetries - 1);
        }
        if (current) return setConflict(current);
        if (lockedNotebook(err)) return setLockedMeanwhile(true);
        const fields: NotebookSettingsProblems = {};
        const other: string[] = [];
        if (err instanceof ApiRequestError && err.statusCode === 400) {
          for (const [apiField, message] of Object.entries(err.fieldErrors)) {
            const field = formFieldOf(apiField);
            if (field) fields[field] = message;
            else other.push(message);
          }
        }
        setProblems(fields);
        if (!Object.keys(fields).length || other.length) setFailure(other.length ? other.join('; ') : errorMessage(err));
      },
    });
  };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!conflict) save(revision);
  };

  const applyOntoCurrent = () => {
    if (!conflict) return;
    setRevision(conflict.revision);
    setConflict(null);
    save(conflict.revision);
  };

  // A click beside the dialog must not throw away what was typed; Cancel and Escape are deliberate.
  const dismiss = (_: unknown, reason?: string) => {
    if (reason !== 'backdropClick') onClose();
  };

  const field = (name: NotebookSettingsField, hint?: string) => ({
    value: form[name],
    onChange: edit(name),
    error: !!problems[name],
    helperText: problems[name] ?? hint,
  });

  return (
    <Dialog open onClose={dismiss} fullWidth maxWidth="sm" aria-labelledby="notebook-settings-title">
      <form onSubmit={submit} noValidate>
        <DialogTitle id="notebook-settings-title">Notebook settings</DialogTitle>
        <DialogContent>
          <Stack spacing={2} sx={{ pt: 1 }}>
            {conflict && !locked && (
              <Alert severity="warning" role="alert">
                Someone else changed this notebook while you were editing (now revision {conflict.revision}). Its title is now
                {' '}“{conflict.title}”. Your changes below are not saved yet: apply them onto the current version, or cancel.
              </Alert>
            )}
            {locked && (
              <Alert severity="error" role="alert">
                This notebook was locked while you were editing, so its settings can no longer change. Your changes below were not saved.
              </Alert>
            )}
            {failure && <Alert severity="error">{failure}</Alert>}
            <TextField label="Title" {...field('title')} autoFocus required />
            <TextField label="Summary" {...field('summary', 'What question the notebook tests.')} multiline minRows={2} />
            <TextField label="Tags" {...field('tags', 'Separated by commas or spaces, e.g. twin-primes, wheel')} />
            <TextField
              label="Required sign-offs"
              type="number"
              {...field('requiredSignoffs', `How many reviewers must sign off before the notebook can be locked (${SIGNOFFS_MIN} to ${SIGNOFFS_MAX}).`)}
              slotProps={{ htmlInput: { min: SIGNOFFS_MIN, max: SIGNOFFS_MAX, step: 1 } }}
            />
          </Stack>
        </DialogContent>
        <DialogActions>
          <Button onClick={onClose}>Cancel</Button>
          {conflict && !locked ? (
            <Button variant="contained" onClick={applyOntoCurrent} disabled={update.isPending}>
              Apply my changes to revision {conflict.revision}
            </Button>
          ) : (
            <Button type="submit" variant="contained" disabled={update.isPending || locked}>
              {update.isPending ? 'Saving…' : 'Save settings'}
            </Button>
          )}
        </DialogActions>
      </form>
    </Dialog>
  );
}
