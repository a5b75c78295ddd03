import { latexText } from './latex-text';

/** A chart output as @cribra/lang writes it (kind 'chart'). */
export interface ChartData {
  chart?: string;
  title?: string | null;
  x?: { label?: string; log?: boolean };
  y?: { label?: string; log?: boolean };
  series?: Array<{ name?: string; points?: Array<[number | string, number | null]> }>;
}

/** More points than this per series are left out of the figure (the caption says so); TeX's memory is small. */
export const CHART_POINT_LIMIT = 2000;

const num = (v: number): string => (Number.isInteger(v) && Math.abs(v) < 1e15 ? String(v) : v.toExponential(12));

/**
 * A chart as a pgfplots figure drawn from its data: axis labels, logarithmic axes, one plot and
 * legend entry per series. Text x values (a bar chart of categories) become ticks 0, 1, 2 … with
 * their labels. Points a logarithmic axis cannot show (≤ 0) and missing values are left out.
 */
export function chartToPgfplots(c: ChartData): string {
  const series = (c.series ?? []).filter((s) => Array.isArray(s.points));
  const logX = !!c.x?.log;
  const logY = !!c.y?.log;
  const categories: string[] = [];
  const xOf = (x: number | string): number | null => {
    if (typeof x === 'number') return Number.isFinite(x) ? x : null;
    let i = categories.indexOf(x);
    if (i < 0) i = categories.push(x) - 1;
    return i;
  };
  let dropped = 0;
  const plots = series.map((s) => {
    const coords: string[] = [];
    for (const [x0, y] of s.points!) {
      const x = xOf(x0);
      if (x === null || y === null || !Number.isFinite(y) || (logY && y <= 0) || (logX && typeof x0 === 'number' && x <= 0)) continue;
      if (coords.length >= CHART_POINT_LIMIT) {
        dropped++;
        continue;
      }
      coords.push(`(${num(x)},${num(y)})`);
    }
    return { name: s.name ?? '', coords };
  }).filter((p) => p.coords.length > 0);
  if (!plots.length) return `\\noindent Chart${c.title ? `: ${latexText(c.title)}` : ''} (no points to draw).`;
  const bar = c.chart === 'bar';
  const opts = [
    'width=0.92\\linewidth',
    'height=0.55\\linewidth',
    `xlabel={${latexText(c.x?.label ?? '')}}`,
    `ylabel={${latexText(c.y?.label ?? '')}}`,
    logX && !categories.length ? 'xmode=log' : '',
    logY ? 'ymode=log' : '',
    bar ? 'ybar' : '',
    bar ? `bar width=${Math.max(2, Math.min(12, Math.floor(240 / Math.max(1, plots[0]?.coords.length ?? 1))))}pt` : '',
    categories.length ? `xtick={${categories.map((_, i) => i).join(',')}}` : '',
    categories.length ? `xticklabels={${categories.map((k) => `{${latexText(k)}}`).join(',')}}` : '',
    plots.length > 1 ? 'legend pos=outer north east' : '',
    'scaled ticks=false',
    'tick label style={font=\\footnotesize}',
    'unbounded coords=discard',
  ].filter(Boolean);
  const body = plots.flatMap((p) => [
    `\\addplot${bar ? '' : c.chart === 'scatter' ? '+[only marks, mark size=1.2pt]' : '+[mark size=1pt]'} coordinates {${p.coords.join(' ')}};`,
    plots.length > 1 ? `\\addlegendentry{${latexText(p.name)}}` : '',
  ]);
  const caption = [
    c.title ? latexText(c.title) : `${latexText(plots.map((p) => p.name).join(', ') || 'Chart')}`,
    dropped ? ` (the first ${CHART_POINT_LIMIT} points of each series are drawn; ${dropped} left out)` : '',
  ].join('');
  return [
    '\\begin{figure}[htbp]',
    '\\centering',
    '\\begin{tikzpicture}',
    `\\begin{axis}[${opts.join(', ')}]`,
    ...body.filter(Boolean),
    '\\end{axis}',
    '\\end{tikzpicture}',
    `\\caption{${caption}}`,
    '\\end{figure}',
  ].join('\n');
}
