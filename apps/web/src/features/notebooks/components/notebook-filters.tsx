import { MEMBER_ROLES, NOTEBOOK_STATUSES, type MemberRole, type NotebookStatus } from '@cribra/contracts';
import { Box, MenuItem, TextField } from '@mui/material';
import { STATUS_LABEL } from '../lib/status-label';

export interface FilterValues {
  q: string;
  status: NotebookStatus | '';
  role: MemberRole | '';
  tag: string;
}

interface Props {
  values: FilterValues;
  onChange: (next: Partial<FilterValues>) => void;
}

// Show "Any …" in an unset select instead of an empty box under its label.
const shownEmpty = { inputLabel: { shrink: true }, select: { displayEmpty: true } };

export function NotebookFilters({ values, onChange }: Props) {
  return (
    <Box role="search" sx={{ display: 'grid', gridTemplateColumns: '2fr 1fr 1fr 1fr', gap: 1.5, mb: 2 }}>
      <TextField label="Search titles, summaries and tags" type="search" value={values.q} onChange={(e) => onChange({ q: e.target.value })} />
      <TextField select label="Status" value={values.status} slotProps={shownEmpty} onChange={(e) => onChange({ status: e.target.value as NotebookStatus | '' })}>
        <MenuItem value="">Any status</MenuItem>
        {NOTEBOOK_STATUSES.map((s) => <MenuItem key={s} value={s}>{STATUS_LABEL[s]}</MenuItem>)}
      </TextField>
      <TextField select label="My role" value={values.role} slotProps={shownEmpty} onChange={(e) => onChange({ role: e.target.value as MemberRole | '' })}>
        <MenuItem value="">Any role</MenuItem>
        {MEMBER_ROLES.map((r) => <MenuItem key={r} value={r}>{r}</MenuItem>)}
      </TextField>
      <TextField label="Tag" value={values.tag} onChange={(e) => onChange({ tag: e.target.value })} />
    </Box>
  );
}
