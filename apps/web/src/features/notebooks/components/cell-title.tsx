import { CELL_TITLE_MAX, type CellView } from '@cribra/contracts';
import { Button, ButtonBase, TextField, Typography } from '@mui/material';
import { useState } from 'react';
import { errorMessage } from '../../../lib/api-error';
import { useUpdateCell } from '../api/update-cell';

interface Props {
  cell: CellView;
  index: number;
  canEdit: boolean;
}

/** The optional title of a cell card: shown beside the kind; editors rename it in place (a title is no new cell revision). */
export function CellTitle({ cell, index, canEdit }: Props) {
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState(cell.title ?? '');
  const update = useUpdateCell();
  const save = () => {
    const title = text.trim() || null;
    if (title === cell.title) return setEditing(false);
    update.mutate({ id: cell.id, body: { revision: cell.revision, title } }, { onSuccess: () => setEditing(false) });
  };
  if (editing) {
    return (
      <TextField
        size="small" autoFocus value={text} sx={{ flex: 1, maxWidth: 520 }}
        label={`Title of cell ${index + 1}`}
        slotProps={{ htmlInput: { maxLength: CELL_TITLE_MAX } }}
        error={update.isError} helperText={update.isError ? errorMessage(update.error) : undefined}
        onChange={(e) => setText(e.target.value)}
        onBlur={save}
        onKeyDown={(e) => {
          if (e.key === 'Enter') save();
          if (e.key === 'Escape') { setText(cell.title ?? ''); setEditing(false); }
        }}
      />
    );
  }
  if (cell.title) {
    return (
      <Typography component="h3" sx={{ fontWeight: 600 }}>
        {canEdit ? (
          <ButtonBase title="Rename" aria-label={`${cell.title} (rename cell ${index + 1})`}
            sx={{ font: 'inherit', cursor: 'text', borderRadius: 0.5, px: 0.25 }}
            onClick={() => { setText(cell.title ?? ''); setEditing(true); }}>
            {cell.title}
          </ButtonBase>
        ) : cell.title}
      </Typography>
    );
  }
  return canEdit ? <Button size="small" onClick={() => { setText(''); setEditing(true); }}>Add title</Button> : null;
}
