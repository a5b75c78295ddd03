import { ACTIVE_RUN_STATUSES, type CellKind, type CellView } from '@cribra/contracts';
import { Alert, Box, Button, Chip, Collapse, Paper, Typography } from '@mui/material';
import { useState } from 'react';
import { LazyNoteView } from '../../../components/note/lazy-note-view';
import { LazySiftEditor } from '../../../components/sift-editor/lazy-sift-editor';
import { errorMessage } from '../../../lib/api-error';
import { monoFont } from '../../../lib/design-tokens';
import { useCancelRun } from '../api/cancel-run';
import { useRunCell } from '../api/run-cell';
import { useCellDraft } from '../hooks/use-cell-draft';
import { CellConflict } from './cell-conflict';
import { CellStatusLine } from './cell-status-line';
import { CellTitle } from './cell-title';
import { CellToolbar } from './cell-toolbar';
import { RunHistory } from './run-history';
import { RunOutputs } from './run-outputs';
import { RunProgress } from './run-progress';

const KIND_LABEL: Record<CellKind, string> = { query: 'QUERY', claim: 'CLAIM', note: 'NOTE' };

interface Props {
  cell: CellView;
  index: number;
  count: number;
  canEdit: boolean;
  canRun: boolean;
  onMove: (cell: CellView, by: -1 | 1) => void;
  onDelete: (cell: CellView) => void;
  onAddBelow: (cell: CellView) => void;
  /** Names of the others whose editor has the focus in this cell now (presence). */
  othersEditing?: string[];
  onEditingChange?: (cellId: string | null) => void;
}

/** One cell as a card of the lab record: kind, source, latest outputs, status line. */
export function CellCard({ cell, index, count, canEdit, canRun, onMove, onDelete, onAddBelow, othersEditing = [], onEditingChange }: Props) {
  const d = useCellDraft(cell);
  const runCell = useRunCell();
  const cancel = useCancelRun();
  const [historyOpen, setHistoryOpen] = useState(false);
  const [editingNote, setEditingNote] = useState(cell.source === '');
  const run = cell.latestRun;
  const active = !!run && ACTIVE_RUN_STATUSES.includes(run.status);
  const runnable = cell.kind !== 'note';

  const doRun = async (text?: string) => {
    if (!runnable || !canRun || active) return;
    const saved = canEdit ? await d.save(text).catch(() => null) : cell;
    if (saved) runCell.mutate(saved.id);
  };
  const actionError = d.saveError ?? runCell.error ?? cancel.error;

  return (
    <Paper component="section" aria-label={`Cell ${index + 1}, ${cell.kind}${cell.title ? `: ${cell.title}` : ''}`} data-cell-id={cell.id} sx={{ p: 1.5 }}>
      <Box sx={{ display: 'flex', alignItems: 'center', gap: 1, mb: 1 }}>
        <Typography sx={{ fontFamily: monoFont, color: 'text.secondary', minWidth: 24 }}>{index + 1}</Typography>
        <Chip size="small" label={KIND_LABEL[cell.kind]} variant={cell.kind === 'claim' ? 'filled' : 'outlined'}
          sx={{ fontWeight: 600, letterSpacing: '0.08em', borderRadius: 1 }} />
        <CellTitle key={`${cell.id}-${cell.title ?? ''}`} cell={cell} index={index} canEdit={canEdit} />
        {othersEditing.length > 0 && (
          <Chip size="small" color="warning" variant="outlined" data-testid="cell-presence"
            label={`${othersEditing.join(', ')} ${othersEditing.length === 1 ? 'is' : 'are'} editing`} />
        )}
        <Box sx={{ flex: 1 }} />
        {cell.kind === 'note' && canEdit && (
          <Button onClick={() => (editingNote ? void d.save().then((s) => s && setEditingNote(false)) : setEditingNote(true))}>
            {editingNote ? 'Done' : 'Edit note'}
          </Button>
        )}
        <CellToolbar
          runnable={runnable} canRun={canRun} canEdit={canEdit} active={active} dirty={d.dirty} saving={d.saving}
          isFirst={index === 0} isLast={index === count - 1} historyOpen={historyOpen}
          onRun={() => void doRun()} onCancel={() => run && cancel.mutate(run.id)} onSave={() => void d.save()}
          onMove={(by) => onMove(cell, by)} onDelete={() => onDelete(cell)} onToggleHistory={() => setHistoryOpen((o) => !o)}
        />
      </Box>
      {cell.kind === 'note' && !editingNote ? (
        <LazyNoteView source={d.draft || '*Empty note.*'} />
      ) : (
        <LazySiftEditor
          value={d.draft}
          replaceKey={d.replaceKey}
          onChange={d.setDraft}
          onRun={(text) => void doRun(text)}
          onSave={(text) => void d.save(text)}
          onAddBelow={() => onAddBelow(cell)}
          onFocusChange={(focused) => onEditingChange?.(focused ? cell.id : null)}
          readOnly={!canEdit}
          label={`Source of cell ${index + 1} (${cell.kind})`}
          path={`cell-${cell.id}.${cell.kind === 'note' ? 'md' : 'sift'}`}
          language={cell.kind === 'note' ? 'markdown' : undefined}
        />
      )}
      {d.conflict && (
        <CellConflict mine={d.draft} theirs={d.conflict} baseRevision={d.baseRevision} saving={d.saving}
          language={cell.kind === 'note' ? 'markdown' : undefined}
          onKeepMine={() => void d.keepMine()} onTakeTheirs={d.takeTheirs} onSaveMerge={(t) => void d.saveMerge(t)} />
      )}
      {d.behind && !d.conflict && (
        <Alert severity="info" sx={{ mt: 1 }}>
          {cell.author.displayName} saved revision {cell.revision} while you were editing; saving will show both texts to merge.
        </Alert>
      )}
      {actionError && <Alert severity="error" sx={{ mt: 1 }}>{errorMessage(actionError)}</Alert>}
      {run && active && <RunProgress run={run} />}
      {run && !active && runnable && <RunOutputs run={run} />}
      <CellStatusLine cell={cell} dirty={d.dirty} />
      <Collapse in={historyOpen} unmountOnExit>
        <Box sx={{ mt: 1 }}><RunHistory cellId={cell.id} /></Box>
      </Collapse>
    </Paper>
  );
}
