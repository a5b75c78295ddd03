import { Box, Chip, Paper, Typography } from '@mui/material';
import { monoFont, palette } from '../../lib/design-tokens';
import type { VerdictOutput } from '../../lib/sift-output';
import { bindingText } from '../../lib/value-text';
import { verdictSentence } from '@cribra/lang';
import { useContext } from 'react';
import { VerdictContextValue } from './verdict-context';
import { counterexampleText } from './verdict-text';

/** A claim's verdict: holds for every case of its range (all checked) or fails with its counterexample. */
export function VerdictCard({ output }: { output: VerdictOutput }) {
  const context = useContext(VerdictContextValue);
  const colour = output.holds ? palette.holds : palette.fails;
  return (
    <Paper
      component="section"
      aria-label={`Claim ${output.holds ? 'holds' : 'fails'}`}
      sx={{ p: 2, borderLeft: `4px solid ${colour}` }}
    >
      <Box sx={{ display: 'flex', alignItems: 'center', gap: 1.5, mb: 1 }}>
        <Chip
          label={output.holds ? 'HOLDS' : 'FAILS'}
          size="small"
          sx={{ bgcolor: colour, color: '#fff', fontWeight: 600, letterSpacing: '0.08em', borderRadius: 1 }}
        />
        {output.label && <Typography variant="h4" component="p">{output.label}</Typography>}
      </Box>
      <Typography sx={{ fontFamily: monoFont, mb: 1, wordBreak: 'break-word' }}>{output.statement}</Typography>
      {/* One sentence says what was shown, the range once (the recorded summary stays in the digest). */}
      <Typography data-testid="verdict-range">{verdictSentence(output, context)}</Typography>
      {!output.holds && output.counterexample && (
        <Box sx={{ mt: 1.5, p: 1.5, bgcolor: 'rgba(163, 50, 31, 0.06)', borderRadius: 1 }}>
          <Typography sx={{ fontWeight: 600 }}>Counterexample</Typography>
          <Typography sx={{ fontFamily: monoFont }}>{bindingText(output.counterexample.binding)}</Typography>
          <Typography color="text.secondary">{counterexampleText(output.counterexample)}</Typography>
        </Box>
      )}
    </Paper>
  );
}
