import type { RunView } from '@cribra/contracts';
import { api } from '../../../lib/api-client';

export function getRun(id: string, signal?: AbortSignal): Promise<RunView> {
  return api.get<RunView>(`/runs/${id}`, { signal });
}
