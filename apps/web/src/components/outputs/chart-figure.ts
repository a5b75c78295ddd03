import { monoFont, palette, sansFont } from '../../lib/design-tokens';
import type { ChartOutput } from '../../lib/sift-output';

// Series colours: the accent first, then muted inks that stay apart on paper.
const SERIES_COLOURS = [palette.accent, '#8a5a2b', '#4b5d8a', '#7a3e6e', '#5f6b2e', '#3e3e3e'];

/** Plotly data and layout for a Sift chart spec (no Plotly import here, so it is testable). */
export function chartFigure(spec: ChartOutput) {
  const data = spec.series.map((s, i) => ({
    type: spec.chart === 'bar' ? 'bar' : 'scatter',
    mode: spec.chart === 'line' ? 'lines' : spec.chart === 'scatter' ? 'markers' : undefined,
    name: s.name,
    x: s.points.map(([x]) => x),
    y: s.points.map(([, y]) => y),
    marker: { color: SERIES_COLOURS[i % SERIES_COLOURS.length], size: 5 },
    line: { color: SERIES_COLOURS[i % SERIES_COLOURS.length], width: 1.5 },
  }));
  const axis = (a: ChartOutput['x']) => ({
    title: { text: a.label },
    type: a.log ? 'log' : '-',
    gridcolor: palette.rule,
    zerolinecolor: palette.rule,
    tickfont: { family: monoFont, size: 11 },
    separatethousands: true,
    // Log axes read 10², 10³… rather than SI suffixes (1k, 1M), which are not the field's notation.
    exponentformat: a.log ? 'power' : 'none',
  });
  const layout = {
    // Title at the left: the tool bar Plotly shows on hover sits at the top right.
    title: spec.title ? { text: spec.title, font: { size: 14 }, x: 0.01, xanchor: 'left' } : undefined,
    xaxis: axis(spec.x),
    yaxis: axis(spec.y),
    paper_bgcolor: palette.sheet,
    plot_bgcolor: palette.sheet,
    font: { family: sansFont, color: palette.ink, size: 12 },
    margin: { l: 60, r: 20, t: spec.title ? 40 : 16, b: 48 },
    showlegend: spec.series.length > 1,
    legend: { orientation: 'h', y: -0.2 },
    separators: '.\u2009',
    autosize: true,
  };
  return { data, layout };
}
