import { Box } from '@mui/material';
import Plotly from 'plotly.js-dist-min';
import { useEffect, useRef } from 'react';
import type { ChartOutput } from '../../lib/sift-output';
import { chartFigure } from './chart-figure';

/** Loaded lazily: this module pulls in Plotly (several MB), only where a chart is shown. */
export default function PlotlyChart({ spec }: { spec: ChartOutput }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const { data, layout } = chartFigure(spec);
    void Plotly.react(el, data, layout, { displaylogo: false, responsive: true, modeBarButtonsToRemove: ['sendDataToCloud'] });
    return () => Plotly.purge(el);
  }, [spec]);
  return <Box ref={ref} role="img" aria-label={spec.title ?? 'Chart'} sx={{ width: '100%', height: 340 }} />;
}
