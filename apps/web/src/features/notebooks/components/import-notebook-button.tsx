import type { NotebookView } from '@cribra/contracts';
import { Alert, Box, Button } from '@mui/material';
import { useRef } from 'react';
import { errorMessage } from '../../../lib/api-error';
import { importProblems, useImportNotebook } from '../api/import-notebook';

interface Props {
  onImported: (nb: NotebookView) => void;
}

/** "New notebook from file": picks a `.sift` notebook file and imports it; refused files list their lines. */
export function ImportNotebookButton({ onImported }: Props) {
  const input = useRef<HTMLInputElement>(null);
  const importing = useImportNotebook();
  const problems = importing.error ? importProblems(importing.error) : null;
  return (
    <>
      <Button variant="outlined" size="medium" disabled={importing.isPending} onClick={() => input.current?.click()}>
        {importing.isPending ? 'Reading…' : 'New notebook from file'}
      </Button>
      <input
        ref={input}
        type="file"
        accept=".sift,.txt,text/plain"
        hidden
        aria-label="Notebook file (.sift)"
        onChange={(e) => {
          const file = e.target.files?.[0];
          e.target.value = '';
          if (file) importing.mutate(file, { onSuccess: onImported });
        }}
      />
      {importing.isError && (
        <Box sx={{ flexBasis: '100%' }}>
          <Alert severity="error" sx={{ mt: 1 }} onClose={() => importing.reset()}>
            Nothing was imported: {errorMessage(importing.error)}
            {problems && problems.errors.length > 1 && (
              <Box component="ul" sx={{ m: 0, pl: 2 }}>
                {problems.errors.map((p, i) => <li key={i}>line {p.line}: {p.message}</li>)}
              </Box>
            )}
          </Alert>
        </Box>
      )}
    </>
  );
}
