import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { ChartOutput, TableOutput, ValueOutput, VerdictOutput } from '../../lib/sift-output';
import { renderWithApp } from '../../test-utils/render';
import { chartFigure } from './chart-figure';
import { OutputView } from './output-view';
import { VerdictContextValue } from './verdict-context';

// 2^64 = 18446744073709551616 (exact; OEIS A000079 lists powers of 2).
const big: ValueOutput = { kind: 'value', label: 'two to the 64', value: { t: 'int', v: '18446744073709551616' }, text: '18446744073709551616' };

const holds: VerdictOutput = {
  kind: 'verdict',
  label: 'twin pattern admissible',
  statement: 'claim admissible((0, 2)) over p in primes 3..97',
  holds: true,
  over: 'p ∈ primes 3..97',
  checked: 24,
  skipped: 0,
  first: [['p', { t: 'int', v: '3' }]],
  last: [['p', { t: 'int', v: '97' }]],
  counterexample: null,
  summary: 'Holds for every p checked.',
};

const fails: VerdictOutput = {
  ...holds,
  statement: 'claim p + 2 is prime over p in primes 3..97',
  holds: false,
  checked: 3,
  last: [['p', { t: 'int', v: '7' }]],
  counterexample: { binding: [['p', { t: 'int', v: '7' }]], relation: null, lhs: { t: 'bool', v: false }, rhs: null },
  summary: 'Fails at p = 7.',
};

describe('OutputView', () => {
  it('shows an exact value with grouped digits and copies it without the spaces', async () => {
    const writeText = vi.fn(async () => undefined);
    Object.defineProperty(navigator, 'clipboard', { value: { writeText }, configurable: true });
    renderWithApp(<OutputView output={big} />);
    const shown = await screen.findByTestId('value-output');
    expect(shown.textContent).toBe('18\u2009446\u2009744\u2009073\u2009709\u2009551\u2009616');
    expect(screen.getByText('20 digits')).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Copy exact value' }));
    await waitFor(() => expect(writeText).toHaveBeenCalledWith('18446744073709551616'));
  });

  it('says once what a holding claim showed: every case of its range checked', async () => {
    renderWithApp(<OutputView output={holds} />);
    const card = await screen.findByRole('region', { name: 'Claim holds' });
    expect(card.textContent).toContain('HOLDS');
    expect(screen.getByTestId('verdict-range').textContent).toBe('holds for every p ∈ primes 3..97 (24 cases, every case checked)');
    expect(card.textContent!.split('primes 3..97').length - 1).toBe(2); // the statement and the sentence, nothing more
    expect(card.textContent).not.toContain(holds.summary);
  });

  it('says that the broader statement is not established when the claim name states more', async () => {
    const broad: VerdictOutput = { ...holds, label: 'admissible for every level' };
    renderWithApp(<OutputView output={broad} />);
    expect((await screen.findByTestId('verdict-range')).textContent).toBe(
      "holds for every p ∈ primes 3..97 (24 cases, every case checked); the claim's name states more than this range, and that broader statement is not established",
    );
  });

  it("reads the notebook's notes: a note that states more than the range is answered once", async () => {
    renderWithApp(
      <VerdictContextValue.Provider value={{ notes: ['We expect this for every level p.'] }}>
        <OutputView output={holds} />
      </VerdictContextValue.Provider>,
    );
    const card = await screen.findByRole('region', { name: 'Claim holds' });
    expect(screen.getByTestId('verdict-range').textContent).toBe(
      'holds for every p ∈ primes 3..97 (24 cases, every case checked); a note states more than this range, and that broader statement is not established',
    );
    expect(card.textContent!.split('not established').length - 1).toBe(1);
  });

  it('a claim without a range says it was checked once, with no empty "from … to"', async () => {
    const once: VerdictOutput = { ...holds, over: null, checked: 1, first: [], last: [] };
    renderWithApp(<OutputView output={once} />);
    expect((await screen.findByTestId('verdict-range')).textContent).toBe('holds (a statement without a range, checked once)');
  });

  it('shows the counterexample of a failing claim', async () => {
    renderWithApp(<OutputView output={fails} />);
    const card = await screen.findByRole('region', { name: 'Claim fails' });
    expect(card.textContent).toContain('FAILS');
    expect(card.textContent).toContain('Counterexample');
    expect(card.textContent).toContain('p = 7');
    expect(card.textContent).not.toMatch(/not a proof/);
  });

  it('puts a table in the data grid with its column names and exact values', async () => {
    const table: TableOutput = {
      kind: 'table',
      label: 'gaps',
      columns: ['p', 'next gap'],
      rows: [
        [{ t: 'int', v: '113' }, { t: 'int', v: '14' }],
        [{ t: 'int', v: '1327' }, { t: 'int', v: '34' }],
      ],
    };
    renderWithApp(<OutputView output={table} />);
    expect(await screen.findByRole('columnheader', { name: 'next gap' })).toBeTruthy();
    const cells = await screen.findAllByRole('gridcell');
    expect(cells.map((c) => c.textContent)).toEqual(['113', '14', '1\u2009327', '34']);
    expect(screen.getByText('2 rows')).toBeTruthy();
  }, 15_000);

  it('shows an output of an unknown kind as JSON instead of dropping it', async () => {
    renderWithApp(<OutputView output={{ kind: 'histogram', bins: [1, 2] } as { kind: string }} />);
    expect((await screen.findByText(/"histogram"/)).textContent).toContain('"bins"');
  });
});

describe('chartFigure', () => {
  it('turns a Sift chart spec into Plotly traces and log axes', () => {
    const spec: ChartOutput = {
      kind: 'chart',
      chart: 'line',
      title: 'π(x)',
      x: { label: 'x', log: true },
      y: { label: 'count', log: false },
      series: [
        { name: 'π(x)', points: [[10, 4], [100, 25], [1000, 168]] },
        { name: 'x / log x', points: [[10, 4.34], [100, 21.7], [1000, null]] },
      ],
    };
    const { data, layout } = chartFigure(spec);
    expect(data).toHaveLength(2);
    expect(data[0]).toMatchObject({ type: 'scatter', mode: 'lines', name: 'π(x)', x: [10, 100, 1000], y: [4, 25, 168] });
    expect(data[1].y).toEqual([4.34, 21.7, null]);
    expect(layout.xaxis.type).toBe('log');
    expect(layout.yaxis.type).toBe('-');
    expect(layout.showlegend).toBe(true);
  });

  it('draws bars for a bar chart', () => {
    const { data } = chartFigure({ kind: 'chart', chart: 'bar', title: null, x: { label: 'gap', log: false }, y: { label: 'n', log: false }, series: [{ name: 'gaps', points: [[2, 3]] }] });
    expect(data[0].type).toBe('bar');
    expect(data[0].mode).toBeUndefined();
  });
});
