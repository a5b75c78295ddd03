import { EmptyState } from '../../../components/empty-state';
import { PageHeader } from '../../../components/page-header';
import { useDocumentTitle } from '../../../hooks/use-document-title';

export default function NotebooksPage() {
  useDocumentTitle('Notebooks');
  return (
    <>
      <PageHeader title="Notebooks" subtitle="Query, claim and note cells over admissible tuples, wheels and prime gaps." />
      <EmptyState title="No notebooks yet">Notebooks appear here once the notebook service is running.</EmptyState>
    </>
  );
}
