import { Box, CircularProgress } from '@mui/material';
import { lazy, Suspense } from 'react';
import type { ChartOutput } from '../../lib/sift-output';

const PlotlyChart = lazy(() => import('./plotly-chart'));

export function ChartOutputView({ output }: { output: ChartOutput }) {
  return (
    <Suspense
      fallback={
        <Box role="status" sx={{ height: 340, display: 'grid', placeItems: 'center' }}>
          <CircularProgress size={18} aria-label="Loading chart" />
        </Box>
      }
    >
      <PlotlyChart spec={output} />
    </Suspense>
  );
}
