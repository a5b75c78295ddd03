import type { NotebookStateTopic } from '@cribra/contracts';
import type { QueryClient } from '@tanstack/react-query';
import { collabKeys } from './keys';

/**
 * Refetches the side panel's queries that a live change on the notebook's event stream concerns
 * (the notebook itself is refetched by the notebooks feature). A finished run ('run') changes
 * what blocks a lock and may finish a re-verify.
 */
export function refreshCollaboration(qc: QueryClient, notebookId: string, topic: NotebookStateTopic | 'run'): void {
  const keys: ReadonlyArray<readonly unknown[]> = {
    status: [collabKeys.review(notebookId), collabKeys.reviews(notebookId), collabKeys.lock(notebookId), collabKeys.audit(notebookId)],
    review: [collabKeys.review(notebookId), collabKeys.reviews(notebookId), collabKeys.audit(notebookId)],
    verification: [collabKeys.review(notebookId), collabKeys.verifications(notebookId), ['verifications']],
    lock: [collabKeys.review(notebookId), collabKeys.lock(notebookId), collabKeys.audit(notebookId)],
    members: [collabKeys.invitations(notebookId), collabKeys.review(notebookId), collabKeys.audit(notebookId)],
    run: [collabKeys.review(notebookId), collabKeys.verifications(notebookId), ['verifications']],
    presence: [],
  }[topic];
  for (const queryKey of keys) void qc.invalidateQueries({ queryKey });
}
