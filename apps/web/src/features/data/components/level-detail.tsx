import { Alert, Box, Table, TableBody, TableCell, TableHead, TableRow, Typography } from '@mui/material';
import { ChartOutputView } from '../../../components/outputs/chart-output-view';
import { LoadingState } from '../../../components/loading-state';
import { errorMessage } from '../../../lib/api-error';
import { groupDigits } from '../../../lib/format';
import type { ChartOutput } from '../../../lib/sift-output';
import { useLevel } from '../api/get-level';

/** One stored level: its gap histogram as a chart (doubles) and as a table (exact counts). */
export function LevelDetail({ prime }: { prime: number }) {
  const level = useLevel(prime);
  if (level.isPending) return <LoadingState label={`Loading level ${prime}…`} />;
  if (level.isError) return <Alert severity="error">{errorMessage(level.error)}</Alert>;
  const l = level.data;
  if (l.status !== 'stored') return <Alert severity="info">Level {prime} is {l.status}; its histogram appears once it is stored.</Alert>;
  const spec: ChartOutput = {
    kind: 'chart',
    chart: 'bar',
    title: `Gaps between consecutive members of ${prime}#`,
    x: { label: 'gap', log: false },
    y: { label: 'count', log: l.histogram.length > 1 && Number(l.histogram[0]?.count ?? 0) > 1e6 },
    series: [{ name: 'gaps', points: l.histogram.map((g) => [g.gap, Number(g.count)]) }],
  };
  return (
    <Box component="section" aria-label={`Level ${prime}`}>
      <Typography variant="h3" component="h2" sx={{ mb: 1 }}>Level {prime}</Typography>
      <Typography className="mono" variant="body2" sx={{ mb: 1, wordBreak: 'break-all' }}>
        {prime}# = {groupDigits(l.modulus)} · φ = {groupDigits(l.phi)} · largest gap {l.largestGap ?? '—'} · digest {l.digest?.slice(0, 16) ?? '—'}
      </Typography>
      <ChartOutputView output={spec} />
      <Table size="small" aria-label={`Gap histogram of level ${prime}`} sx={{ maxWidth: 360 }}>
        <TableHead><TableRow><TableCell align="right">gap</TableCell><TableCell align="right">count</TableCell></TableRow></TableHead>
        <TableBody>
          {l.histogram.map((g) => (
            <TableRow key={g.gap}><TableCell align="right" className="mono">{g.gap}</TableCell><TableCell align="right" className="mono">{groupDigits(g.count)}</TableCell></TableRow>
          ))}
        </TableBody>
      </Table>
    </Box>
  );
}
