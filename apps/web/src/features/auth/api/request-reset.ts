import type { ResetRequestBody } from '@cribra/contracts';
import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** Always answers 202, whether or not the address has an account (no address probing). */
export function requestReset(body: ResetRequestBody): Promise<void> {
  return api.post<void>('/auth/reset/request', body);
}

export function useRequestReset() {
  return useMutation({ mutationFn: requestReset });
}
