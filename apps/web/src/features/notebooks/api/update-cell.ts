import type { CellView, StaleCellDetails, UpdateCellBody } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { ApiRequestError } from '../../../lib/api-error';
import { putCachedCell } from './notebook-cache';

export function updateCell(id: string, body: UpdateCellBody): Promise<CellView> {
  return api.put<CellView>(`/cells/${id}`, body);
}

/** The current cell when a save was refused as stale (409), else null. */
export function staleCell(err: unknown): CellView | null {
  if (!(err instanceof ApiRequestError) || err.statusCode !== 409) return null;
  const d = err.details as StaleCellDetails | undefined;
  return d?.reason === 'stale_revision' && d.current ? d.current : null;
}

export function useUpdateCell() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: UpdateCellBody }) => updateCell(id, body),
    onSuccess: (cell) => putCachedCell(qc, cell),
  });
}
