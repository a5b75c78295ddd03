import { Box, Divider } from '@mui/material';
import { useState } from 'react';
import { PageHeader } from '../../../components/page-header';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { LedgerSection } from '../components/ledger-section';
import { LevelDetail } from '../components/level-detail';
import { LevelsSection } from '../components/levels-section';

export default function DataPage() {
  useDocumentTitle('Data');
  const [selected, setSelected] = useState<number | null>(null);
  return (
    <>
      <PageHeader title="Data" subtitle="Stored wheel levels and the prime ledger that Sift cells read." />
      <Box sx={{ display: 'grid', gridTemplateColumns: selected ? 'minmax(0, 1fr) minmax(0, 1fr)' : '1fr', gap: 3 }}>
        <LevelsSection selected={selected} onSelect={setSelected} />
        {selected !== null && <LevelDetail prime={selected} />}
      </Box>
      <Divider sx={{ my: 3 }} />
      <LedgerSection />
    </>
  );
}
