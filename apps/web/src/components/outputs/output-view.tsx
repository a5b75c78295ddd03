import { Box } from '@mui/material';
import type { SiftOutput } from '../../lib/sift-output';
import { monoFont } from '../../lib/design-tokens';
import { ChartOutputView } from './chart-output-view';
import { TableOutputView } from './table-output-view';
import { TextOutputView } from './text-output-view';
import { ValueOutputView } from './value-output-view';
import { VerdictCard } from './verdict-card';

interface Props {
  /** One output as stored on a run (`RunOutput` is the loose JSON form of a SiftOutput). */
  output: { kind: string };
  /** Used to name a table's CSV download. */
  fileName?: string;
}

/** Draws one run output by its kind; an unknown kind is shown as JSON rather than dropped. */
export function OutputView({ output, fileName }: Props) {
  const o = output as SiftOutput;
  switch (o.kind) {
    case 'value':
      return <ValueOutputView output={o} />;
    case 'table':
      return <TableOutputView output={o} fileName={fileName} />;
    case 'chart':
      return <ChartOutputView output={o} />;
    case 'verdict':
      return <VerdictCard output={o} />;
    case 'text':
      return <TextOutputView output={o} />;
    default:
      return (
        <Box component="pre" sx={{ fontFamily: monoFont, fontSize: 12, m: 0, overflowX: 'auto' }}>
          {JSON.stringify(output, null, 2)}
        </Box>
      );
  }
}
