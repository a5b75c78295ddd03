import type { AuditEventView } from '@cribra/contracts';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

/**
 * The API answers the latest events only, newest first, without paging
 * (`AuditService.listForNotebook`, limit 200).
 */
export const AUDIT_LIST_LIMIT = 200;

export function listAudit(notebookId: string, signal?: AbortSignal): Promise<AuditEventView[]> {
  return api.get<AuditEventView[]>(`/notebooks/${notebookId}/audit`, { signal });
}

/** The notebook's history (owner and admins only: the API refuses everyone else with 403). */
export function useNotebookAudit(notebookId: string) {
  return useQuery({ queryKey: collabKeys.audit(notebookId), queryFn: ({ signal }) => listAudit(notebookId, signal) });
}
