import type { NotebookStatus } from '@cribra/contracts';

export const STATUS_LABEL: Record<NotebookStatus, string> = {
  draft: 'Draft',
  in_review: 'In review',
  locked: 'Locked',
};

export const STATUS_COLOUR: Record<NotebookStatus, 'default' | 'warning' | 'success'> = {
  draft: 'default',
  in_review: 'warning',
  locked: 'success',
};
