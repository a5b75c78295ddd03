import { Box } from '@mui/material';
import { monoFont } from '../../lib/design-tokens';
import type { TextOutput } from '../../lib/sift-output';

export function TextOutputView({ output }: { output: TextOutput }) {
  return (
    <Box component="pre" sx={{ fontFamily: monoFont, m: 0, whiteSpace: 'pre-wrap', wordBreak: 'break-word' }}>
      {output.text}
    </Box>
  );
}
