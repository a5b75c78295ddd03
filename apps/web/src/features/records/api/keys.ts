export const recordKeys = {
  record: (id: string) => ['records', id] as const,
  publication: (notebookId: string) => ['notebooks', notebookId, 'publication'] as const,
};
