import type { RecordCitation } from '@cribra/contracts';
import { Box, Typography } from '@mui/material';
import { CopyButton } from '../../../components/outputs/copy-button';
import { monoFont } from '../../../lib/design-tokens';

const pre = { fontFamily: monoFont, fontSize: 12, m: 0, p: 1.5, bgcolor: 'background.default', border: 1, borderColor: 'divider', borderRadius: 1, overflowX: 'auto', whiteSpace: 'pre-wrap', wordBreak: 'break-all' } as const;

/** How to cite the record: a plain-text reference and a BibTeX entry, each with a copy button. */
export function CitationBlock({ citation, verifyCommand }: { citation: RecordCitation; verifyCommand: string }) {
  return (
    <Box component="section" aria-label="How to cite this record">
      <Typography variant="h3" component="h2" gutterBottom>How to cite it</Typography>
      <Typography sx={{ mb: 1 }} data-testid="citation-text">{citation.text}</Typography>
      <Box sx={{ display: 'flex', alignItems: 'flex-start', gap: 1 }}>
        <Box component="pre" sx={{ ...pre, flex: 1 }} aria-label="BibTeX entry">{citation.bibtex}</Box>
        <CopyButton text={citation.bibtex} label="Copy BibTeX" />
      </Box>
      <Typography variant="h3" component="h2" sx={{ mt: 3 }} gutterBottom>Check it yourself</Typography>
      <Typography variant="body2" sx={{ mb: 1 }}>
        The command line re-runs every query and claim of the record with your own engine and compares each output digest:
      </Typography>
      <Box sx={{ display: 'flex', alignItems: 'flex-start', gap: 1 }}>
        <Box component="pre" sx={{ ...pre, flex: 1 }} aria-label="Verify command">{verifyCommand}</Box>
        <CopyButton text={verifyCommand} label="Copy command" />
      </Box>
    </Box>
  );
}
