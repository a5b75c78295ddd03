import type { MemberRole, NotebookStatus, NotebookSummary } from '@cribra/contracts';
import { Alert, Box, Button, Pagination, Paper } from '@mui/material';
import { useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { EmptyState } from '../../../components/empty-state';
import { ErrorState } from '../../../components/error-state';
import { LoadingState } from '../../../components/loading-state';
import { PageHeader } from '../../../components/page-header';
import { useDebouncedValue } from '../../../hooks/use-debounced-value';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { errorMessage } from '../../../lib/api-error';
import { useDuplicateNotebook } from '../api/duplicate-notebook';
import { useNotebooks } from '../api/list-notebooks';
import { CreateNotebookDialog } from '../components/create-notebook-dialog';
import { ImportNotebookButton } from '../components/import-notebook-button';
import { type FilterValues, NotebookFilters } from '../components/notebook-filters';
import { NotebooksTable } from '../components/notebooks-table';

const PAGE_SIZE = 20;

export default function NotebooksPage() {
  useDocumentTitle('Notebooks');
  const navigate = useNavigate();
  const [params, setParams] = useSearchParams();
  const [creating, setCreating] = useState(false);
  const values: FilterValues = {
    q: params.get('q') ?? '',
    status: (params.get('status') ?? '') as NotebookStatus | '',
    role: (params.get('role') ?? '') as MemberRole | '',
    tag: params.get('tag') ?? '',
  };
  const page = Number(params.get('page') ?? '1') || 1;
  const q = useDebouncedValue(values.q);
  const tag = useDebouncedValue(values.tag);
  const list = useNotebooks({
    q: q || undefined,
    tag: tag || undefined,
    status: values.status || undefined,
    role: values.role || undefined,
    page,
    pageSize: PAGE_SIZE,
  });
  const duplicate = useDuplicateNotebook();
  const filtered = Object.values(values).some(Boolean);

  const change = (next: Partial<FilterValues> & { page?: number }) => {
    const merged = { ...values, page: 1, ...next };
    setParams(Object.fromEntries(Object.entries(merged).filter(([k, v]) => v && !(k === 'page' && v === 1)).map(([k, v]) => [k, String(v)])), { replace: true });
  };
  const onDuplicate = (nb: NotebookSummary) => duplicate.mutate(nb.id, { onSuccess: (copy) => navigate(`/notebooks/${copy.id}`) });

  return (
    <>
      <PageHeader
        title="Notebooks"
        subtitle="Query, claim and note cells over admissible tuples, wheels and prime gaps."
        actions={
          <>
            <Button variant="contained" size="medium" onClick={() => setCreating(true)}>New notebook</Button>
            <ImportNotebookButton onImported={(nb) => navigate(`/notebooks/${nb.id}`)} />
          </>
        }
      />
      <NotebookFilters values={values} onChange={change} />
      {duplicate.isError && <Alert severity="error" sx={{ mb: 2 }}>Could not duplicate: {errorMessage(duplicate.error)}</Alert>}
      {list.isPending && <LoadingState label="Loading notebooks…" />}
      {list.isError && <ErrorState error={list.error} title="Could not load notebooks" onRetry={() => list.refetch()} />}
      {list.isSuccess && list.data.items.length === 0 && (
        filtered ? (
          <EmptyState title="No notebook matches" action={<Button onClick={() => setParams({})}>Clear the filters</Button>} />
        ) : (
          <EmptyState title="No notebooks yet" action={<Button variant="contained" onClick={() => setCreating(true)}>Create the first one</Button>}>
            A notebook holds query, claim and note cells and their results, ready for review.
          </EmptyState>
        )
      )}
      {list.isSuccess && list.data.items.length > 0 && (
        <>
          <Paper sx={{ overflowX: 'auto', opacity: list.isPlaceholderData ? 0.6 : 1 }}>
            <NotebooksTable notebooks={list.data.items} onDuplicate={onDuplicate} duplicatingId={duplicate.isPending ? duplicate.variables : undefined} />
          </Paper>
          {list.data.total > PAGE_SIZE && (
            <Box sx={{ display: 'flex', justifyContent: 'center', mt: 2 }}>
              <Pagination count={Math.ceil(list.data.total / PAGE_SIZE)} page={page} onChange={(_, p) => change({ ...values, page: p })} />
            </Box>
          )}
        </>
      )}
      <CreateNotebookDialog open={creating} onClose={() => setCreating(false)} onCreated={(nb) => navigate(`/notebooks/${nb.id}`)} />
    </>
  );
}
