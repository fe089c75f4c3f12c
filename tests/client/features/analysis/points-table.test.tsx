// @vitest-environment jsdom
import { act, cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { PointsTable, type PointRow } from '@/features/analysis/components/points-table';

/** jsdom lays nothing out: give every element the widths a phone would measure for the table's box. */
function layOut(widths: { scrollWidth: number; clientWidth: number }) {
  for (const [name, value] of Object.entries(widths)) {
    Object.defineProperty(HTMLElement.prototype, name, { configurable: true, get: () => value });
  }
}

afterEach(() => {
  cleanup();
  for (const name of ['scrollWidth', 'clientWidth']) Reflect.deleteProperty(HTMLElement.prototype, name);
});

const ROUND_1 = { event: 'Tallow Creek MC — Spring Round 1 (12 Apr 2026)', marker: { glyph: '●', color: '#E69F00', name: 'circle' } };
const ROUND_2 = { event: 'Tallow Creek MC — Spring Round 2 (3 May 2026)', marker: { glyph: '▲', color: '#56B4E9', name: 'triangle' } };

function row(key: number, partial: Partial<PointRow>): PointRow {
  return { key, ...ROUND_1, runs: '1 run', setup: 'Baseline', x: '−1.50°', y: '+1.23 %', ...partial };
}

/** Two events, two drivers sharing the car, one point per timed run. */
const SHARED_CAR: PointRow[] = [
  row(0, { driver: 'Maren Holt', runNumber: 2, y: '+0.80 %' }),
  row(1, { driver: 'Tomas Reyes', runNumber: 3, y: '+2.10 %' }),
  row(2, { driver: 'Maren Holt', runNumber: 5, y: '+0.40 %' }),
  row(3, { ...ROUND_2, driver: 'Maren Holt', runNumber: 1, setup: 'More camber', x: '−2.00°', y: '+0.50 %' }),
];

function renderTable(rows: PointRow[], withCorner = false) {
  render(
    <PointsTable id="points" caption="Camber (°) against off the day's best (%)" xHeading="Camber (°)" yHeading="Off the day's best (%)" withCorner={withCorner} rows={rows} />,
  );
  return screen.getByRole('table', { name: "Camber (°) against off the day's best (%)" });
}

const texts = (elements: Element[]) => elements.map((e) => e.textContent);

describe('the points table', () => {
  it('when runs from two events are listed, then each event heads its rows once and a row gives the driver and run number, then the plotted values', () => {
    const table = renderTable(SHARED_CAR);

    expect(texts(within(table).getAllByRole('columnheader'))).toEqual(['Driver, run', 'Camber (°)', "Off the day's best (%)", 'Setup']);
    const groups = table.querySelectorAll('tbody');
    expect(groups).toHaveLength(2);
    const headings = [...groups].map((g) => g.querySelector('th[scope="rowgroup"]'));
    expect(headings.map((h) => h?.textContent)).toEqual([`●circle ${ROUND_1.event}`, `▲triangle ${ROUND_2.event}`]);
    // The event's name is written once per event, never on its runs' rows.
    expect(within(table).getAllByText(ROUND_1.event, { exact: false })).toHaveLength(1);

    const runs = [...groups[0]!.querySelectorAll('tr')].slice(1);
    expect(runs.map((r) => [...r.children].map((c) => `${c.tagName}:${c.textContent}`))).toEqual([
      ['TH:Maren Holt · run 2', 'TD:−1.50°', 'TD:+0.80 %', 'TD:Baseline'],
      ['TH:Tomas Reyes · run 3', 'TD:−1.50°', 'TD:+2.10 %', 'TD:Baseline'],
      ['TH:Maren Holt · run 5', 'TD:−1.50°', 'TD:+0.40 %', 'TD:Baseline'],
    ]);
    expect(runs[0]!.querySelector('th')?.getAttribute('scope')).toBe('row');
  });

  it('when every point is one run by the same driver, then neither has a column and one line above the table says so', () => {
    const table = renderTable(SHARED_CAR.map((r) => ({ ...r, driver: 'Maren Holt' })));

    expect(texts(within(table).getAllByRole('columnheader'))).toEqual(['Run', 'Camber (°)', "Off the day's best (%)", 'Setup']);
    expect(within(table).queryByText('1 run')).toBeNull();
    expect(within(table).queryByText(/Maren Holt/)).toBeNull();
    const note = screen.getByText('Every row: 1 run · driver Maren Holt.');
    expect(table.getAttribute('aria-describedby')).toBe(note.id);
    expect(texts(within(table).getAllByRole('rowheader').filter((h) => h.getAttribute('scope') === 'row'))).toEqual(['Run 2', 'Run 3', 'Run 5', 'Run 1']);
  });

  it('when wear intervals are listed, then a row is told apart by its corner and the runs between readings stay as a column', () => {
    const table = renderTable(
      [
        row(0, { corner: 'LF', runs: '6 runs', x: '32.0 psi', y: '0.063/32 in per run' }),
        row(1, { corner: 'RF', runs: '5 runs', x: '30.0 psi', y: '0.050/32 in per run' }),
        row(2, { ...ROUND_2, corner: 'LF', runs: '4 runs', x: '31.0 psi', y: '0.040/32 in per run', setup: 'More camber' }),
      ],
      true,
    );

    expect(texts(within(table).getAllByRole('columnheader'))).toEqual(['Corner', 'Camber (°)', "Off the day's best (%)", 'Setup', 'Runs']);
    const first = table.querySelectorAll('tbody')[0]!.querySelectorAll('tr')[1]!;
    expect(texts([...first.children])).toEqual(['LF', '32.0 psi', '0.063/32 in per run', 'Baseline', '6 runs']);
  });

  it('when the table is wider than its box, then a line says what a swipe shows, and it goes when the box is wide enough', () => {
    layOut({ scrollWidth: 643, clientWidth: 324 });
    renderTable(SHARED_CAR);
    const box = screen.getByRole('region', { name: "Camber (°) against off the day's best (%)" });
    const hint = screen.getByText('Swipe the table sideways for the setup.');
    expect(box.getAttribute('aria-describedby')).toBe(hint.id);
    expect(box.getAttribute('tabindex')).toBe('0');

    layOut({ scrollWidth: 643, clientWidth: 700 });
    act(() => void window.dispatchEvent(new Event('resize')));
    expect(screen.queryByText(/Swipe the table sideways/)).toBeNull();
    expect(box.getAttribute('aria-describedby')).toBeNull();
  });

  it('when the table fits its box, then no line asks for a swipe', () => {
    layOut({ scrollWidth: 324, clientWidth: 324 });
    renderTable(SHARED_CAR);
    expect(screen.getByRole('table')).toBeTruthy();
    expect(screen.queryByText(/Swipe the table sideways/)).toBeNull();
  });
});
