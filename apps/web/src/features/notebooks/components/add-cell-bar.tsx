import { CELL_KINDS, type CellKind } from '@cribra/contracts';
import { Box, Button } from '@mui/material';

const LABEL: Record<CellKind, string> = { query: 'Add query', claim: 'Add claim', note: 'Add note' };

export function AddCellBar({ onAdd, disabled }: { onAdd: (kind: CellKind) => void; disabled?: boolean }) {
  return (
    <Box role="group" aria-label="Add a cell" sx={{ display: 'flex', gap: 1, justifyContent: 'center', py: 1 }}>
      {CELL_KINDS.map((k) => (
        <Button key={k} variant="outlined" onClick={() => onAdd(k)} disabled={disabled}>+ {LABEL[k]}</Button>
      ))}
    </Box>
  );
}
