import type { ResetConfirmBody } from '@cribra/contracts';
import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export function confirmReset(body: ResetConfirmBody): Promise<void> {
  return api.post<void>('/auth/reset/confirm', body);
}

export function useConfirmReset() {
  return useMutation({ mutationFn: confirmReset });
}
