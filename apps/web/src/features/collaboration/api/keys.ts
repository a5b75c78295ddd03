export const collabKeys = {
  invitations: (notebookId: string) => ['notebooks', notebookId, 'invitations'] as const,
  review: (notebookId: string) => ['notebooks', notebookId, 'review'] as const,
  reviews: (notebookId: string) => ['notebooks', notebookId, 'reviews'] as const,
  verification: (id: string) => ['verifications', id] as const,
  verifications: (notebookId: string) => ['notebooks', notebookId, 'verifications'] as const,
  lock: (notebookId: string) => ['notebooks', notebookId, 'lock'] as const,
  threads: (notebookId: string) => ['notebooks', notebookId, 'threads'] as const,
  audit: (notebookId: string) => ['notebooks', notebookId, 'audit'] as const,
};
