import { EmptyState } from '../../../components/empty-state';
import { PageHeader } from '../../../components/page-header';
import { useDocumentTitle } from '../../../hooks/use-document-title';

export default function DataPage() {
  useDocumentTitle('Data');
  return (
    <>
      <PageHeader title="Data" subtitle="Stored wheel levels, the prime ledger and uploads." />
      <EmptyState title="No stored data yet">Stored wheel levels and prime ledger blocks appear here once computed.</EmptyState>
    </>
  );
}
