import type { CellKind, CellView, NotebookView } from '@cribra/contracts';
import { Alert, Stack } from '@mui/material';
import { useMemo, useState } from 'react';
import { VerdictContextValue } from '../../../components/outputs/verdict-context';
import { EmptyState } from '../../../components/empty-state';
import { errorMessage } from '../../../lib/api-error';
import { useCreateCell } from '../api/create-cell';
import { useDeleteCell } from '../api/delete-cell';
import { useReorderCells } from '../api/reorder-cells';
import { AddCellBar } from './add-cell-bar';
import { CellCard } from './cell-card';
import { ConfirmDialog } from './confirm-dialog';

const STARTER: Record<CellKind, string> = { query: '', claim: '', note: '' };

interface Props {
  notebook: NotebookView;
  canEdit: boolean;
  canRun: boolean;
  /** Cell id → names of the others editing it now (presence). */
  editingBy?: Map<string, string[]>;
  onEditingChange?: (cellId: string | null) => void;
}

export function CellList({ notebook, canEdit, canRun, editingBy, onEditingChange }: Props) {
  const create = useCreateCell(notebook.id);
  const remove = useDeleteCell(notebook.id);
  const reorder = useReorderCells(notebook.id);
  const [deleting, setDeleting] = useState<CellView | null>(null);
  const cells = notebook.cells;
  // Verdicts read the notes: a note that states more than a claim's range is answered in its sentence.
  const verdictContext = useMemo(() => ({ notes: cells.filter((c) => c.kind === 'note').map((c) => c.source) }), [cells]);

  const add = (kind: CellKind, position?: number) => create.mutate({ kind, source: STARTER[kind], position });
  const move = (cell: CellView, by: -1 | 1) => {
    const ids = cells.map((c) => c.id);
    const i = ids.indexOf(cell.id);
    const j = i + by;
    if (j < 0 || j >= ids.length) return;
    [ids[i], ids[j]] = [ids[j], ids[i]];
    reorder.mutate({ revision: notebook.revision, cellIds: ids });
  };
  const error = create.error ?? remove.error ?? reorder.error;

  const list = (
    <Stack spacing={1.5}>
      {error && <Alert severity="error">{errorMessage(error)}</Alert>}
      {cells.length === 0 && (
        <EmptyState title="This notebook has no cells yet">
          {canEdit ? 'Add a query to compute, a claim to test over a range, or a note to explain.' : 'Nothing has been written here yet.'}
        </EmptyState>
      )}
      {cells.map((cell, i) => (
        <CellCard
          key={cell.id}
          cell={cell}
          index={i}
          count={cells.length}
          canEdit={canEdit}
          canRun={canRun}
          onMove={move}
          onDelete={setDeleting}
          onAddBelow={(c) => canEdit && add('query', c.position + 1)}
          othersEditing={editingBy?.get(cell.id)}
          onEditingChange={onEditingChange}
        />
      ))}
      {canEdit && <AddCellBar onAdd={(k) => add(k)} disabled={create.isPending} />}
      <ConfirmDialog
        open={!!deleting}
        title="Delete this cell?"
        text="The cell and its run history go. This cannot be undone."
        confirmLabel="Delete cell"
        onClose={() => setDeleting(null)}
        onConfirm={() => {
          if (deleting) remove.mutate({ id: deleting.id, revision: deleting.revision });
          setDeleting(null);
        }}
      />
    </Stack>
  );
  return <VerdictContextValue.Provider value={verdictContext}>{list}</VerdictContextValue.Provider>;
}
