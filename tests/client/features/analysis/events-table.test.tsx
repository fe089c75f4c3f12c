// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import type { SeasonResult } from '../../../../shared/analysis/analysis.schema';
import { EventsTable } from '@/features/analysis/components/events-table';
import type { DriverSeries } from '@/features/analysis/components/season-timeline';
import { seriesStyle } from '@/features/analysis/utils/series-styles';

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

const texts = (elements: Element[]) => elements.map((e) => e.textContent);

describe("the timeline's table", () => {
  const season: SeasonResult = {
    carId: 'c1',
    events: [
      {
        eventId: 'e2',
        name: 'Tallow Creek MC — Spring Round 2',
        date: '2026-05-03',
        venue: 'Airfield east apron',
        drivers: [{ driver: { id: 'd1', displayName: 'Maren Holt' }, bestRawSec: 47.1, bestAdjustedSec: 47.1, runCount: 5, cones: 0, classPosition: null }],
      },
      {
        eventId: 'e1',
        name: 'Tallow Creek MC — Spring Round 1',
        date: '2026-04-12',
        venue: null,
        drivers: [
          { driver: { id: 'd1', displayName: 'Maren Holt' }, bestRawSec: 48.1, bestAdjustedSec: 48.1, runCount: 4, cones: 1, classPosition: null },
          { driver: { id: 'd2', displayName: 'Tomas Reyes' }, bestRawSec: 49.2, bestAdjustedSec: 49.2, runCount: 3, cones: 0, classPosition: null },
        ],
      },
    ],
    setupChanges: [],
    changeLog: [],
    tyreLife: [],
  };
  const drivers: DriverSeries[] = [
    { id: 'd1', name: 'Maren Holt', style: seriesStyle(0), points: [] },
    { id: 'd2', name: 'Tomas Reyes', style: seriesStyle(1), points: [] },
  ];

  it('when the events are listed, then each row starts with its date as the row heading, then the times, and the event comes last', () => {
    render(<EventsTable id="events" season={season} drivers={drivers} />);
    const table = screen.getByRole('table', { name: /^Best adjusted time per event/ });

    expect(texts(within(table).getAllByRole('columnheader'))).toEqual(['Date', '● Maren Holt', '▲ Tomas Reyes', 'Event']);
    const rows = [...table.querySelectorAll('tbody tr')];
    expect(rows.map((r) => [...r.children].map((c) => `${c.tagName}:${c.textContent}`))).toEqual([
      [expect.stringMatching(/^TH:.*2026$/), 'TD:48.100 s4 runs, 1 cone', 'TD:49.200 s3 runs, 0 cones', 'TD:Tallow Creek MC — Spring Round 1'],
      [expect.stringMatching(/^TH:.*2026$/), 'TD:47.100 s5 runs, 0 cones', 'TD:—', 'TD:Tallow Creek MC — Spring Round 2 · Airfield east apron'],
    ]);
    expect(rows[0]!.querySelector('th')?.getAttribute('scope')).toBe('row');
  });

  it('when the table is wider than its box, then a line says a swipe shows the events, and none when it fits', () => {
    layOut({ scrollWidth: 520, clientWidth: 324 });
    render(<EventsTable id="events" season={season} drivers={drivers} />);
    expect(screen.getByText("Swipe the table sideways for the events' names.")).toBeTruthy();
    cleanup();

    layOut({ scrollWidth: 324, clientWidth: 324 });
    render(<EventsTable id="events" season={season} drivers={drivers} />);
    expect(screen.queryByText(/Swipe the table sideways/)).toBeNull();
  });
});
