import { Box, Typography } from '@mui/material';
import { groupNumbersInText } from '../../lib/format';
import { monoFont } from '../../lib/design-tokens';
import type { ValueOutput } from '../../lib/sift-output';
import { valueText } from '../../lib/value-text';
import { CopyButton } from './copy-button';
import { OutputLabel } from './output-label';

/** The display text: the exact `text` of the run, with integer digits grouped. */
function displayText(output: ValueOutput): string {
  if (output.value.t === 'int' || output.value.t === 'rat') return valueText(output.value);
  return groupNumbersInText(output.text);
}

export function ValueOutputView({ output }: { output: ValueOutput }) {
  const digits = output.value.t === 'int' ? output.value.v.replace('-', '').length : null;
  return (
    <Box>
      <OutputLabel>{output.label}</OutputLabel>
      <Box sx={{ display: 'flex', alignItems: 'flex-start', gap: 1 }}>
        <Typography
          component="output"
          data-testid="value-output"
          sx={{ fontFamily: monoFont, fontSize: 18, wordBreak: 'break-all', whiteSpace: 'pre-wrap', flex: 1 }}
        >
          {displayText(output)}
        </Typography>
        <CopyButton text={output.text} />
      </Box>
      {digits !== null && digits > 12 && (
        <Typography variant="caption" color="text.secondary">{digits} digits</Typography>
      )}
    </Box>
  );
}
