import { UPLOAD_EXTENSIONS, UPLOAD_MAX_BYTES } from '@cribra/contracts';
import { Alert, Box, Button, List, ListItem, ListItemText, TextField, Typography } from '@mui/material';
import { useState } from 'react';
import { errorMessage } from '../../../lib/api-error';
import { useCreateUpload, uploadProblems } from '../api/create-upload';
import { useDeleteUpload } from '../api/delete-upload';
import { useUploads } from '../api/list-uploads';
import { UploadDropZone } from './upload-drop-zone';

const ACCEPT = [...UPLOAD_EXTENSIONS.tuples, ...UPLOAD_EXTENSIONS.table].join(',');

/** Files a notebook's cells read by name: list, drag-and-drop upload with line-numbered problems, delete. */
export function UploadsSection({ notebookId, canEdit }: { notebookId: string; canEdit: boolean }) {
  const uploads = useUploads(notebookId);
  const create = useCreateUpload(notebookId);
  const remove = useDeleteUpload(notebookId);
  const [name, setName] = useState('');
  const [tooBig, setTooBig] = useState<string>();
  const problems = uploadProblems(create.error);

  const send = (file: File) => {
    if (file.size > UPLOAD_MAX_BYTES) return setTooBig(`${file.name} is ${Math.ceil(file.size / 1024)} KiB; at most ${UPLOAD_MAX_BYTES / 1024} KiB are accepted.`);
    setTooBig(undefined);
    create.mutate({ file, name: name.trim() || undefined }, { onSuccess: () => setName('') });
  };

  return (
    <Box>
      <Typography variant="h4" component="h3" sx={{ mb: 1 }}>Files</Typography>
      {uploads.isError && <Alert severity="error">{errorMessage(uploads.error)}</Alert>}
      {uploads.data?.length === 0 && <Typography color="text.secondary">No files yet.</Typography>}
      <List dense disablePadding aria-label="Files">
        {uploads.data?.map((u) => (
          <ListItem key={u.id} disableGutters secondaryAction={canEdit && (
            <Button size="small" onClick={() => remove.mutate(u.id)} aria-label={`Delete ${u.name}`}>Delete</Button>
          )}>
            <ListItemText
              primary={<span className="mono">{u.name}</span>}
              secondary={`${u.kind} · ${u.rowCount} ${u.kind === 'tuples' ? 'values' : 'rows'} · sha-256 ${u.sha256.slice(0, 10)}`}
            />
          </ListItem>
        ))}
      </List>
      {canEdit && (
        <Box sx={{ mt: 2, display: 'grid', gap: 1 }}>
          <TextField label="Name for cells (optional)" value={name} onChange={(e) => setName(e.target.value)} helperText="Defaults to the file name." />
          <UploadDropZone onFile={send} disabled={create.isPending} accept={ACCEPT} />
          {tooBig && <Alert severity="error">{tooBig}</Alert>}
          {create.isSuccess && <Alert severity="success" role="status">Stored {create.data.name}.</Alert>}
          {create.isError && (
            <Alert severity="error">
              {problems ? 'The file was refused:' : errorMessage(create.error)}
              {problems && (
                <Box component="ul" sx={{ m: 0, pl: 2 }} aria-label="Problems by line">
                  {problems.errors.slice(0, 20).map((p, i) => <li key={i}>{p.line > 0 ? `line ${p.line}: ` : ''}{p.message}</li>)}
                  {problems.errors.length > 20 && <li>… and {problems.errors.length - 20} more</li>}
                </Box>
              )}
            </Alert>
          )}
        </Box>
      )}
    </Box>
  );
}
