// @vitest-environment jsdom
import { cleanup, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter, Route, Routes } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { CompareResult, Comparison, ScatterPoint, ScatterResult, SeasonResult } from '../../../../shared/analysis/analysis.schema';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES, type UnitPreferences } from '../../../../shared/calc/units.calc';
import type { Corner } from '../../../../shared/season/corners';
import { dropCsrfToken } from '@/lib/api-client';
import { clearToasts } from '@/lib/toast-store';
import { UnitsProvider } from '@/lib/units-context';
import { SeasonReviewPage } from '@/app/routes/analysis/season-review';
import { createTestQueryClient, jsonResponse, requestsTo, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, IDS, list } from '../../fixtures/season';
import { chartGiven, layOutChart, tickLabels } from '../../chart-layout';
import { formatDay } from '@/lib/dates';

// A canvas draws nothing in jsdom: stand in for the chart with the datasets it was given, and keep what it was
// given so a test can hand the same to Chart.js itself.
vi.mock('react-chartjs-2', async () => (await import('../../chart-layout')).chartStandIn);

beforeEach(() => dropCsrfToken());
afterEach(() => {
  cleanup();
  clearToasts();
  vi.unstubAllGlobals();
});

const CAR_PATH = `/api/cars/${IDS.car}`;
const EVENT_A = { eventId: 'e1111111-1111-4111-8111-111111111111', eventName: 'Harrow Flats — Round 3', eventDate: '2026-05-17' };
const EVENT_B = { eventId: 'e2222222-2222-4222-8222-222222222222', eventName: 'Harrow Flats — Round 4', eventDate: '2026-06-07' };
const CHANGE_CAMBER = { id: 'd1111111-1111-4111-8111-111111111111', changedOn: '2026-05-20', what: 'Front camber −1.5° → −2.0°', location: 'front' };
const CHANGE_FLUID = { id: 'd2222222-2222-4222-8222-222222222222', changedOn: '2026-06-01', what: 'Fresh brake fluid', location: 'car' };
/** A quick change between heats: a setup, not a log entry. */
const QUICK_CHANGE = { ...BASE_SETUP, id: '5aaaaaaa-2222-4222-8222-222222222222', label: 'Quick change: rear clicks +2', effectiveFrom: '2026-06-07T10:42:00.000Z' };

function point(partial: Partial<ScatterPoint> & Pick<ScatterPoint, 'x' | 'y'>): ScatterPoint {
  return {
    xNormalized: null,
    runId: 'b1111111-1111-4111-8111-111111111111',
    driver: { id: IDS.maren, displayName: 'Maren Holt' },
    runNumber: 1,
    runs: null,
    ...EVENT_A,
    setupId: IDS.setupBase,
    setupLabel: 'Baseline',
    corner: null,
    ...partial,
  };
}

const CAMBER_TIME: ScatterResult = {
  x: { param: 'camber', corner: 'front', unit: '°' },
  y: { metric: 'time', unit: '%', description: "% off that driver's best at the same event." },
  points: [
    point({ x: -1.5, y: 1.23 }),
    point({ x: -1.5, y: 2.4, runNumber: 3 }),
    point({ x: -2, y: 0.5, ...EVENT_B, setupLabel: 'More camber', driver: { id: IDS.tomas, displayName: 'Tomas Reyes' }, runNumber: 2 }),
  ],
  n: 3,
  fit: { slope: 2.2, intercept: 5, r2: 0.52 },
};

const PRESSURE_TIME: ScatterResult = { ...CAMBER_TIME, x: { param: 'coldPressure', corner: 'front', unit: 'kPa' }, points: [], n: 0, fit: null };

const PRESSURE_WEAR: ScatterResult = {
  x: { param: 'coldPressure', corner: 'front', unit: 'kPa' },
  y: { metric: 'wear', unit: 'mm/run', description: 'Tread lost per run between two readings, mean of inner, middle and outer.' },
  points: [
    point({ x: 220.632, y: 0.05, runId: null, driver: null, runNumber: null, runs: 6, corner: 'lf' }),
    point({ x: 206.8428, y: 0.04, runId: null, driver: null, runNumber: null, runs: 5, corner: 'rf', ...EVENT_B }),
  ],
  n: 2,
  fit: null,
};

function comparison(before: [number, number, number], after: [number, number, number], verdict: string, enough = true): Comparison {
  return {
    before: { n: before[0], mean: before[1], sd: before[2] },
    after: { n: after[0], mean: after[1], sd: after[2] },
    difference: after[1] - before[1],
    tStatistic: -2.1,
    degreesOfFreedom: 6.4,
    pValue: 0.00549,
    enough,
    verdict,
  };
}

const CORNER_N: Record<Corner, [number, number]> = { lf: [5, 4], rf: [6, 3], lr: [2, 5], rr: [3, 1] };

function compareAnswer(changeId: string, what: string, tag: string, timeScope: CompareResult['timeScope'] = { days: 2, leftOut: 30 }): CompareResult {
  const corners = {} as CompareResult['corners'];
  for (const c of ['lf', 'rf', 'lr', 'rr'] as const) {
    const [nb, na] = CORNER_N[c];
    const label = c.toUpperCase();
    corners[c] = {
      innerWear: comparison([nb, 0.06, 0.01], [na, 0.045, 0.008], `${tag}: ${label} inner-edge wear fell by 0.015 mm per run, give or take 0.007.`, nb >= 3 && na >= 3),
      wear: comparison([nb, 0.05, 0.01], [na, 0.048, 0.01], `${tag}: ${label} wear barely moved.`),
      skew: comparison([nb, 0.02, 0.005], [na, 0.004, 0.004], `${tag}: ${label} inner-minus-outer wear fell.`),
    };
  }
  return {
    splitAt: '2026-05-20T00:00:00.000Z',
    change: { id: changeId, what, changedOn: '2026-05-20' },
    corners,
    time: comparison([24, 2.31, 1.1], [18, 1.8, 0.9], `${tag}: % off the day's best fell by 0.51 %, not enough to rule out chance.`, false),
    timeScope,
  };
}

function tyreLife(partial: Partial<SeasonResult['tyreLife'][number]> & Pick<SeasonResult['tyreLife'][number], 'tyreSetId' | 'label'>) {
  return {
    minDepthMm: 1.6,
    latestReadingAt: '2026-06-07T15:00:00.000Z',
    worst: { corner: 'lf' as const, position: 'inner' as const, depthMm: 3.2 },
    mmPerRun: 0.05,
    r2: 0.97,
    n: 4,
    runsLeft: 32,
    alignmentChange: null,
    runsSinceReading: 0,
    ...partial,
  };
}

function season(minDepthMm: number, runsLeft: number): SeasonResult {
  return {
    carId: IDS.car,
    events: [
      {
        eventId: EVENT_A.eventId,
        name: EVENT_A.eventName,
        date: EVENT_A.eventDate,
        venue: 'Harrow Flats airfield',
        drivers: [
          { driver: { id: IDS.maren, displayName: 'Maren Holt' }, bestRawSec: 48.1, bestAdjustedSec: 48.1, runCount: 4, cones: 1, classPosition: null },
          { driver: { id: IDS.tomas, displayName: 'Tomas Reyes' }, bestRawSec: 49.3, bestAdjustedSec: 49.3, runCount: 4, cones: 0, classPosition: null },
        ],
      },
      {
        eventId: EVENT_B.eventId,
        name: EVENT_B.eventName,
        date: EVENT_B.eventDate,
        venue: 'Harrow Flats airfield',
        drivers: [{ driver: { id: IDS.maren, displayName: 'Maren Holt' }, bestRawSec: 46.9, bestAdjustedSec: 46.9, runCount: 5, cones: 2, classPosition: null }],
      },
    ],
    setupChanges: [
      { setupId: IDS.setupBase, label: 'Baseline', effectiveFrom: '2026-04-01T09:00:00.000Z', createdBy: 'Maren Holt', changes: [] },
      {
        setupId: '52222222-2222-4222-8222-222222222222',
        label: 'More camber',
        effectiveFrom: '2026-05-20T09:00:00.000Z',
        createdBy: 'Maren Holt',
        changes: [
          { path: 'corners.lf.camberDeg', corner: 'lf', axle: null, field: 'camberDeg', from: -1.5, to: -2, delta: -0.5 },
          { path: 'corners.rf.camberDeg', corner: 'rf', axle: null, field: 'camberDeg', from: -1.5, to: -2, delta: -0.5 },
        ],
      },
    ],
    changeLog: [
      { ...CHANGE_CAMBER, setupId: null },
      { ...CHANGE_FLUID, setupId: null },
    ],
    tyreLife: [
      tyreLife({ tyreSetId: IDS.tyreSet, label: 'Set A — 205/50R15', minDepthMm, runsLeft }),
      tyreLife({ tyreSetId: 'f2222222-2222-4222-8222-222222222222', label: 'Set B — fresh', mmPerRun: null, r2: null, n: 1, runsLeft: null, minDepthMm }),
    ],
  };
}

const scatterPath = (x: string, y: string, corner = 'front') => `GET ${CAR_PATH}/analysis/scatter?x=${x}&y=${y}&corner=${corner}`;

function stub(extra: Parameters<typeof stubFetch>[0] = {}, minDepth = '1.6') {
  return stubFetch({
    [`GET ${CAR_PATH}`]: jsonResponse(200, CAR),
    [scatterPath('camber', 'time')]: jsonResponse(200, CAMBER_TIME),
    [`GET ${CAR_PATH}/changes`]: list([CHANGE_CAMBER, CHANGE_FLUID]),
    [`GET ${CAR_PATH}/setups`]: list([QUICK_CHANGE, BASE_SETUP]),
    [`GET ${CAR_PATH}/analysis/compare?changeId=${CHANGE_CAMBER.id}`]: jsonResponse(200, compareAnswer(CHANGE_CAMBER.id, CHANGE_CAMBER.what, 'Camber')),
    [`GET ${CAR_PATH}/season?minDepthMm=${minDepth}`]: jsonResponse(200, season(Number(minDepth), 32)),
    ...extra,
  });
}

function renderPage(units: UnitPreferences = METRIC_PREFERENCES) {
  const queryClient = createTestQueryClient();
  render(
    <QueryClientProvider client={queryClient}>
      <UnitsProvider units={units}>
        <MemoryRouter initialEntries={[`/cars/${IDS.car}/review`]}>
          <Routes>
            <Route path="/cars/:carId/review" element={<SeasonReviewPage />} />
          </Routes>
        </MemoryRouter>
      </UnitsProvider>
    </QueryClientProvider>,
  );
  return userEvent.setup();
}

const section = (name: string) => within(screen.getByRole('region', { name }));

describe('season review: setup against time and wear', () => {
  it('when "Show as table" is pressed, then the same points are listed in a table with units, and the caption gives the count and r²', async () => {
    stub();
    const u = renderPage();
    const scatter = section('Setup against time and wear');

    // The chart (lazily loaded) gets one dataset per event and the fitted line as another.
    const chart = await scatter.findByRole('img', { name: /Scatter plot of Camber/ });
    expect(chart.textContent).toMatch(/^Harrow Flats — Round 3 \(.+\): 2; Harrow Flats — Round 4 \(.+\): 1; Fitted line: 2$/);
    expect(scatter.getByText(/3 runs/).closest('p')?.textContent).toMatch(/^3 runs · fitted straight line, r² = 0\.52/);
    expect(scatter.getByText("% off that driver's best at the same event.")).toBeTruthy();
    expect(scatter.queryByRole('table')).toBeNull();

    await u.click(scatter.getByRole('button', { name: 'Show as table' }));
    const table = await scatter.findByRole('table');
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(6); // a heading row, then each event's name above its points (two, then one)
    expect(within(table).getByRole('columnheader', { name: 'Camber (°)' })).toBeTruthy();
    expect(rows[1]!.textContent).toMatch(/^●circle Harrow Flats — Round 3 \(.*2026\)$/);
    // Each run named by its driver and number, as on its event's page.
    expect(within(table).getByRole('columnheader', { name: 'Driver, run' })).toBeTruthy();
    expect([...rows[2]!.children].map((c) => c.textContent)).toEqual(['Maren Holt · run 1', '\u22121.50°', '+1.23 %', 'Baseline']);
    expect(rows[3]!.children[0]!.textContent).toBe('Maren Holt · run 3');
    expect(rows[5]!.children[0]!.textContent).toBe('Tomas Reyes · run 2');
    // Every point is one run: said once, not in a column.
    expect(scatter.getByText('Every row: 1 run.')).toBeTruthy();
    expect(within(rows[5]!).getByText('More camber')).toBeTruthy();
    expect(scatter.getByRole('button', { name: 'Hide table' }).getAttribute('aria-expanded')).toBe('true');
  });

  it('when a run\'s point is tapped, then its tooltip names the driver and the run, as the table does', async () => {
    stub();
    renderPage();
    await section('Setup against time and wear').findByRole('img', { name: /Scatter plot of Camber/ });
    const chart = layOutChart(chartGiven('Scatter plot of Camber'));
    const tip = (dataset: number, index: number) => {
      const point = chart.getDatasetMeta(dataset).data[index]!;
      chart.tooltip!.setActiveElements([{ datasetIndex: dataset, index }], { x: point.x, y: point.y });
      return chart.tooltip!.body.flatMap((b) => b.lines).join(' ');
    };
    expect(tip(0, 1)).toMatch(/^Maren Holt · run 3 Setup: Baseline/);
    expect(tip(1, 0)).toMatch(/^Tomas Reyes · run 2 /);
  });

  it('when the table is shown, then it scrolls sideways in a box of its own, which asks for no swipe while the table fits', async () => {
    stub();
    const u = renderPage();
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot of Camber/ });
    await u.click(scatter.getByRole('button', { name: 'Show as table' }));

    const box = await scatter.findByRole('region', { name: "Camber (°) against off the day's best (%), 3 points" });
    expect(box.getAttribute('tabindex')).toBe('0'); // keys scroll it too
    expect(within(box).getByRole('table', { name: "Camber (°) against off the day's best (%), 3 points" })).toBeTruthy();
    // jsdom lays nothing out, so the table is no wider than its box.
    expect(scatter.queryByText(/Swipe the table sideways/)).toBeNull();
  });

  it('when cold pressure against wear is picked in psi and 1/32 in, then the points convert and a fit-less plot says "not enough data yet"', async () => {
    const fetch = stub(
      { [scatterPath('coldPressure', 'time')]: jsonResponse(200, PRESSURE_TIME), [scatterPath('coldPressure', 'wear')]: jsonResponse(200, PRESSURE_WEAR) },
      '1.5875',
    );
    const u = renderPage(IMPERIAL_PREFERENCES);
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot/ });

    await u.selectOptions(scatter.getByLabelText('Setting (x)'), 'coldPressure');
    await u.selectOptions(scatter.getByLabelText('Measured (y)'), 'wear');
    await waitFor(() => expect(scatter.getByText(/not enough data yet for a fitted line/)).toBeTruthy());
    // The front axle: one point for each corner's interval, said so.
    expect(scatter.getByText(/^2 wear intervals/).textContent).toBe('2 wear intervals (between two tread readings, one point for each corner)');
    expect((scatter.getByLabelText('Where') as HTMLSelectElement).selectedOptions[0]!.textContent).toBe('Front axle (LF and RF)');
    expect(requestsTo(fetch, scatterPath('coldPressure', 'wear'))).toHaveLength(1);

    await u.click(scatter.getByRole('button', { name: 'Show as table' }));
    const rows = within(await scatter.findByRole('table')).getAllByRole('row');
    // 220.632 kPa = 32.0 psi (NIST SP 811); 0.05 mm per run = 0.063/32 in per run.
    // rows[1] is the first event's name, above its point.
    expect(within(rows[2]!).getByText('32.0 psi')).toBeTruthy();
    expect(within(rows[2]!).getByText('0.063/32 in per run')).toBeTruthy();
    expect(within(rows[2]!).getByText('6 runs')).toBeTruthy();
    expect(within(rows[2]!).getByText('LF')).toBeTruthy();
  });
  it('when a setting is plotted, then the lowest and highest values are inside the plot, not on its edges', async () => {
    stub();
    renderPage();
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot of Camber/ });
    const chart = layOutChart(chartGiven('Scatter plot of Camber'));
    // Camber runs from −2.0° to −1.5°: left to Chart.js, the axis ended on those two values exactly.
    expect(chart.scales.x!.min).toBeLessThan(-2);
    expect(chart.scales.x!.max).toBeGreaterThan(-1.5);
    chart.destroy();
  });

  it('when clicks are plotted as counted, then the axis is ticked at whole clicks only, with room either side of the end points', async () => {
    const clicks: ScatterResult = {
      ...CAMBER_TIME,
      x: { param: 'damperClicks', corner: 'front', unit: 'clicks' },
      points: [point({ x: 6, xNormalized: 0.5, y: 1.1 }), point({ x: 7, xNormalized: 0.583, y: 0.9 }), point({ x: 7, xNormalized: 0.583, y: 0.4, ...EVENT_B })],
      fit: { slope: -0.45, intercept: 3.8, r2: 0.5 },
    };
    stub({ [scatterPath('damperClicks', 'time')]: jsonResponse(200, clicks) });
    const u = renderPage();
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot of Camber/ });

    await u.selectOptions(scatter.getByLabelText('Setting (x)'), 'damperClicks');
    await scatter.findByRole('img', { name: /Scatter plot of Damper clicks against/ });
    const chart = layOutChart(chartGiven('Scatter plot of Damper clicks'));
    // Left to Chart.js, 6 to 7 clicks was ticked 6, 6.2, 6.4, … 7 with the points on the plot's edges.
    expect(chart.scales.x!.ticks.map((t) => t.value)).toEqual([6, 7]);
    expect(tickLabels(chart, 'x')).toEqual(['6', '7']);
    expect([chart.scales.x!.min, chart.scales.x!.max]).toEqual([5.5, 7.5]);
    chart.destroy();
  });

  it('when clicks are plotted as a share of the range, then the table shows 0 = softest values beside the clicks', async () => {
    const clicks: ScatterResult = {
      ...CAMBER_TIME,
      x: { param: 'damperClicks', corner: 'front', unit: 'clicks' },
      points: [point({ x: 6, xNormalized: 0.25, y: 1.1 }), point({ x: 12, xNormalized: 0.5, y: 0.9 }), point({ x: 18, xNormalized: 0.75, y: 0.4, ...EVENT_B })],
      fit: { slope: -0.06, intercept: 1.5, r2: 0.9 },
    };
    stub({ [scatterPath('damperClicks', 'time')]: jsonResponse(200, clicks) });
    const u = renderPage();
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot of Camber/ });

    await u.selectOptions(scatter.getByLabelText('Setting (x)'), 'damperClicks');
    await u.click(await scatter.findByRole('radio', { name: /Share of range/ }));
    await u.click(scatter.getByRole('button', { name: 'Show as table' }));

    const table = await scatter.findByRole('table');
    expect(within(table).getByRole('columnheader', { name: 'Clicks (0 = softest, 1 = stiffest)' })).toBeTruthy();
    expect(within(table).getByText('0.25 of the range (6 clicks)')).toBeTruthy();
    expect(scatter.getByRole('img', { name: /share of the range/ }).textContent).toMatch(/Fitted line: 2$/);
  });
});

/** The season review with cold pressure against wear picked, answered with `wear`: the scatter section. */
async function showPressureWear(wear: ScatterResult) {
  stub({ [scatterPath('coldPressure', 'time')]: jsonResponse(200, PRESSURE_TIME), [scatterPath('coldPressure', 'wear')]: jsonResponse(200, wear) });
  const u = renderPage();
  const scatter = section('Setup against time and wear');
  await scatter.findByRole('img', { name: /Scatter plot/ });
  await u.selectOptions(scatter.getByLabelText('Setting (x)'), 'coldPressure');
  await u.selectOptions(scatter.getByLabelText('Measured (y)'), 'wear');
  return scatter;
}

describe('season review: wear intervals the setting changed within', () => {
  it('when intervals were left out because the setting changed between their tread readings, then the plot says how many and why', async () => {
    const wear: ScatterResult = { ...PRESSURE_WEAR, leftOut: { mixedSetting: 3 } };
    const scatter = await showPressureWear(wear);
    const note = await scatter.findByText(/^3 wear intervals left out:/);
    expect(note.closest('p')?.textContent).toBe(
      '3 wear intervals left out: this setting was changed between their two tread readings, so their runs were on more than one value and the wear cannot be credited to any one of them.',
    );
    expect(scatter.getByText(/^2 wear intervals/)).toBeTruthy();
  });

  it('when every interval was left out, then the empty plot still says how many were and why, in the singular for one', async () => {
    const wear: ScatterResult = { ...PRESSURE_WEAR, points: [], n: 0, leftOut: { mixedSetting: 1 } };
    const scatter = await showPressureWear(wear);
    const note = await scatter.findByText(/^1 wear interval left out:/);
    expect(note.closest('p')?.textContent).toMatch(/changed between its two tread readings, so its runs were on more than one value/);
    expect(scatter.getByText(/Not enough data yet: no points/)).toBeTruthy();
  });
});

describe('season review: settings that changed together', () => {
  it('when other settings moved with the plotted one, then the plot names each with its r, and says to change one at a time', async () => {
    const wear: ScatterResult = { ...PRESSURE_WEAR, alsoMoved: [{ field: 'toeMm', r: -0.98 }, { field: 'camberDeg', r: 0.81 }] };
    const scatter = await showPressureWear(wear);
    const note = await scatter.findByText(/^Changed together:/);
    expect(note.closest('p')?.textContent).toBe(
      "Changed together: across these points toe (r = −0.98) and camber (r = 0.81) moved with cold pressure, so a trend here may be theirs as much as cold pressure's. To tell them apart, change one at a time.",
    );
  });

  it('when damper clicks are plotted, then the line names them as damper clicks', async () => {
    const clicks: ScatterResult = { ...CAMBER_TIME, x: { param: 'damperClicks', corner: 'front', unit: 'clicks' }, alsoMoved: [{ field: 'coldPressureKpa', r: 0.9 }] };
    stub({ [scatterPath('damperClicks', 'time')]: jsonResponse(200, clicks) });
    const u = renderPage();
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot of Camber/ });

    await u.selectOptions(scatter.getByLabelText('Setting (x)'), 'damperClicks');
    const note = await scatter.findByText(/^Changed together:/);
    expect(note.closest('p')?.textContent).toContain('cold pressure (r = 0.90) moved with damper clicks, so a trend here may be theirs as much as damper clicks');
  });

  it('when nothing else moved with it, or the answer predates the field, then there is no such line', async () => {
    stub({ [scatterPath('camber', 'time')]: jsonResponse(200, { ...CAMBER_TIME, alsoMoved: [] }) });
    renderPage();
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot/ });
    expect(scatter.queryByText(/Changed together/)).toBeNull();
  });
});

describe('season review: time on each value of the setting', () => {
  const pressureTime = (runOrder: { daysChanged: number; daysInBlocks: number }): ScatterResult => ({
    ...CAMBER_TIME,
    x: { param: 'coldPressure', corner: 'front', unit: 'kPa' },
    points: [point({ x: 206.8428, y: 1.9 }), point({ x: 220.632, y: 0.6, ...EVENT_B }), point({ x: 220.632, y: 0.2, ...EVENT_B })],
    fit: null,
    leftOut: { mixedSetting: 0 },
    perValue: {
      values: [
        { value: 206.8428, n: 1, days: 1, mean: 1.9, sd: null },
        { value: 220.632, n: 14, days: 3, mean: 0.4125, sd: 0.2871 },
      ],
      runOrder,
    },
  });

  it('when the time plot answers with a summary per value, then a table under it gives each value in the user’s unit with its runs, events and average ± spread', async () => {
    stub({ [scatterPath('coldPressure', 'time')]: jsonResponse(200, pressureTime({ daysChanged: 2, daysInBlocks: 0 })) });
    const u = renderPage(IMPERIAL_PREFERENCES);
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot/ });
    await u.selectOptions(scatter.getByLabelText('Setting (x)'), 'coldPressure');

    const table = await scatter.findByRole('table', { name: 'Time for each value of front cold pressure' });
    const rows = within(table).getAllByRole('row');
    expect(within(rows[0]!).getAllByRole('columnheader').map((c) => c.textContent)).toEqual(['Cold pressure', 'Runs', 'Events', "Off the day's best"]);
    const cells = (row: HTMLElement) => [within(row).getByRole('rowheader'), ...within(row).getAllByRole('cell')].map((c) => c.textContent);
    // 206.8428 kPa = 30.0 psi and 220.632 kPa = 32.0 psi (psi = 6894.757 Pa, NIST SP 811).
    expect(cells(rows[1]!)).toEqual(['30.0 psi', '1', '1', '1.90 % (one run: no spread)']);
    expect(cells(rows[2]!)).toEqual(['32.0 psi', '14', '3', '0.41 ± 0.29 %']);
    // The values were alternated through the days they changed: no caution.
    expect(scatter.queryByRole('complementary', { name: 'The values follow run order' })).toBeNull();
  });

  it('when damper clicks are plotted, then the table is headed "front damper clicks" and its values are counted in clicks', async () => {
    const clicksTime: ScatterResult = {
      ...pressureTime({ daysChanged: 2, daysInBlocks: 0 }),
      x: { param: 'damperClicks', corner: 'front', unit: 'clicks' },
      points: [point({ x: 6, xNormalized: 0.5, y: 1.1 }), point({ x: 7, xNormalized: 0.583, y: 0.9 })],
      perValue: {
        values: [
          { value: 6, n: 1, days: 1, mean: 1.1, sd: null },
          { value: 7, n: 1, days: 1, mean: 0.9, sd: null },
        ],
        runOrder: { daysChanged: 2, daysInBlocks: 0 },
      },
    };
    stub({ [scatterPath('damperClicks', 'time')]: jsonResponse(200, clicksTime) });
    const u = renderPage();
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot/ });
    await u.selectOptions(scatter.getByLabelText('Setting (x)'), 'damperClicks');

    const table = await scatter.findByRole('table', { name: 'Time for each value of front damper clicks' });
    expect(scatter.getByRole('heading', { name: 'Time for each value of front damper clicks' })).toBeTruthy();
    const rows = within(table).getAllByRole('row');
    expect(within(rows[0]!).getAllByRole('columnheader')[0]!.textContent).toBe('Clicks');
    expect(rows.slice(1).map((r) => within(r).getByRole('rowheader').textContent)).toEqual(['6 clicks', '7 clicks']);
  });

  it('when every day the setting changed had its values in one block each, then a caution says the later value was run later in the day', async () => {
    stub({ [scatterPath('coldPressure', 'time')]: jsonResponse(200, pressureTime({ daysChanged: 3, daysInBlocks: 3 })) });
    const u = renderPage();
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot/ });
    await u.selectOptions(scatter.getByLabelText('Setting (x)'), 'coldPressure');

    const caution = await scatter.findByRole('complementary', { name: 'The values follow run order' });
    expect(caution.textContent).toMatch(
      /On each of the 3 days this setting was changed between runs, every run on the later value came after every run on the earlier one\. Drivers usually get quicker through a day, so the later value can look quicker than it is/,
    );
  });

  it('when only some of those days had the values in blocks, then the caution gives the count of them', async () => {
    stub({ [scatterPath('coldPressure', 'time')]: jsonResponse(200, pressureTime({ daysChanged: 4, daysInBlocks: 1 })) });
    const u = renderPage();
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot/ });
    await u.selectOptions(scatter.getByLabelText('Setting (x)'), 'coldPressure');

    const caution = await scatter.findByRole('complementary', { name: 'The values follow run order' });
    expect(caution.textContent).toMatch(/On 1 of the 4 days this setting was changed between runs, every run on the later value/);
    expect(scatter.queryByRole('complementary', { name: 'Each value ran on other days' })).toBeNull();
  });

  it('when no day had runs on more than one value, then a caution says this measure cannot compare values run on different days', async () => {
    stub({ [scatterPath('coldPressure', 'time')]: jsonResponse(200, pressureTime({ daysChanged: 0, daysInBlocks: 0 })) });
    const u = renderPage();
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot/ });
    await u.selectOptions(scatter.getByLabelText('Setting (x)'), 'coldPressure');

    const caution = await scatter.findByRole('complementary', { name: 'Each value ran on other days' });
    expect(caution.textContent).toMatch(/No day had runs on more than one of these values.*a change made between events cannot show in these averages/);
    expect(caution.textContent).toMatch(/class board/);
    expect(scatter.queryByRole('complementary', { name: 'The values follow run order' })).toBeNull();
  });

  it('when wear is plotted, then there is no time table, and with none left out no left-out line', async () => {
    const wear: ScatterResult = { ...PRESSURE_WEAR, leftOut: { mixedSetting: 0 }, perValue: null };
    stub({ [scatterPath('coldPressure', 'time')]: jsonResponse(200, pressureTime({ daysChanged: 1, daysInBlocks: 1 })), [scatterPath('coldPressure', 'wear')]: jsonResponse(200, wear) });
    const u = renderPage();
    const scatter = section('Setup against time and wear');
    await scatter.findByRole('img', { name: /Scatter plot/ });
    await u.selectOptions(scatter.getByLabelText('Setting (x)'), 'coldPressure');
    await scatter.findByRole('table', { name: 'Time for each value of front cold pressure' });

    await u.selectOptions(scatter.getByLabelText('Measured (y)'), 'wear');
    await scatter.findByText(/^2 wear intervals/);
    expect(scatter.queryByRole('table', { name: /Time for each value/ })).toBeNull();
    expect(scatter.queryByRole('complementary', { name: 'The values follow run order' })).toBeNull();
    expect(scatter.queryByText(/left out:/)).toBeNull();
  });
});

describe('season review: before and after a change, read in 1/32 in', () => {
  it('when the user reads tread in 1/32 in, then each wear verdict is said again in 1/32 in, never in mm beside numbers in 1/32 in', async () => {
    const answer = compareAnswer(CHANGE_CAMBER.id, CHANGE_CAMBER.what, 'Camber');
    answer.corners.lf.innerWear = { ...answer.corners.lf.innerWear, about: { what: 'LF inner-edge wear', betterWhen: 'lower', counted: 'interval' } };
    stub({ [`GET ${CAR_PATH}/analysis/compare?changeId=${CHANGE_CAMBER.id}`]: jsonResponse(200, answer) });
    renderPage(IMPERIAL_PREFERENCES);
    const compare = section('Before and after a change');
    const lf = within(await compare.findByRole('group', { name: 'Left front' }));

    // 1/32 in = 0.79375 mm (25.4 mm per inch, by definition): 0.060 mm = 0.0756/32 in and 0.045 mm = 0.0567/32 in,
    // written to two significant figures of the change (0.019), as the server writes its own.
    expect(lf.getByText("LF inner-edge wear fell from 0.076 to 0.057 /32 in per run: a clear change. That's an improvement.")).toBeTruthy();
    expect(lf.queryByText(/inner-edge wear.*mm per run/)).toBeNull();
    // A measurement the server sent without its words keeps the server's sentence.
    expect(lf.getByText('Camber: LF wear barely moved.')).toBeTruthy();
  });
});

describe('season review: a change with too few tread readings after it', () => {
  it('when no corner has enough intervals on both sides, then one line says so, with the counts, instead of twelve', async () => {
    const answer = compareAnswer(CHANGE_CAMBER.id, CHANGE_CAMBER.what, 'Camber');
    for (const c of ['lf', 'rf', 'lr', 'rr'] as const) {
      // LF has the most before but none after; RR is the nearest to enough (2 after).
      const few = comparison([c === 'lf' ? 7 : 5, 0.05, 0.01], [c === 'rr' ? 2 : 0, 0.04, 0.01], 'Not enough data yet: 7 intervals before and 0 after.', false);
      answer.corners[c] = { innerWear: few, wear: few, skew: few };
    }
    stub({ [`GET ${CAR_PATH}/analysis/compare?changeId=${CHANGE_CAMBER.id}`]: jsonResponse(200, answer) });
    renderPage();
    const compare = section('Before and after a change');

    expect(
      await compare.findByText(
        'Not enough tread readings yet to compare wear across this change: a corner needs 3 intervals on each side, and the nearest has 5 before and 2 after.',
      ),
    ).toBeTruthy();
    expect(compare.queryByText(/^Not enough data yet/)).toBeNull();
    expect(compare.queryByRole('group', { name: 'Left front' })).toBeNull();
    // The time comparison still shows.
    expect(compare.getByText('(24 runs)')).toBeTruthy();
  });
});

describe('season review: before and after a change', () => {
  it('when the page opens, then the latest camber change is compared and each corner shows its counts, average ± spread, p and its verdict as written', async () => {
    stub();
    renderPage();
    const compare = section('Before and after a change');

    await compare.findByText('Camber: LF inner-edge wear fell by 0.015 mm per run, give or take 0.007.');
    expect((compare.getByLabelText('Change to compare across') as HTMLSelectElement).value).toBe(CHANGE_CAMBER.id);
    for (const c of ['lf', 'rf', 'lr', 'rr'] as const) {
      const name = { lf: 'Left front', rf: 'Right front', lr: 'Left rear', rr: 'Right rear' }[c];
      const corner = within(compare.getByRole('group', { name }));
      const label = c.toUpperCase();
      expect(corner.getByText(`Camber: ${label} inner-edge wear fell by 0.015 mm per run, give or take 0.007.`)).toBeTruthy();
      expect(corner.getByText(`Camber: ${label} wear barely moved.`)).toBeTruthy();
      expect(corner.getByText(`Camber: ${label} inner-minus-outer wear fell.`)).toBeTruthy();
      const intervals = (n: number) => `(${n} interval${n === 1 ? '' : 's'})`;
      expect(corner.getAllByText(intervals(CORNER_N[c][0])).length).toBe(3);
      expect(corner.getAllByText(intervals(CORNER_N[c][1])).length).toBe(3);
    }
    // Mean ± sd, in mm per run, before and after.
    const lf = within(compare.getByRole('group', { name: 'Left front' }));
    expect(lf.getByText('0.060 ± 0.010 mm per run', { exact: false })).toBeTruthy();
    expect(lf.getByText('0.045 ± 0.008 mm per run', { exact: false })).toBeTruthy();
    // p to two significant figures (formatP), not to three decimals (0.005), and said once what it means.
    expect(lf.getAllByText(/· p = 0\.0055$/).length).toBe(3);
    const note = compare.getByText(/p is how often a change at least this large would turn up by chance alone/).textContent;
    expect(note).toMatch(/under 0\.05 is\s+called a clear change, up to 0\.2 a hint/);
    expect(note).toMatch(/one may read “clear” by chance alone/);
    expect(compare.queryByText(/\bdf\b|\(n = /)).toBeNull();
    // The time comparison below, with its uncertainty.
    expect(compare.getByText("Camber: % off the day's best fell by 0.51 %, not enough to rule out chance.")).toBeTruthy();
    expect(compare.getByText(/2\.31 ± 1\.10 %/)).toBeTruthy();
    expect(compare.getByText('(24 runs)')).toBeTruthy();
  });

  it('when the setup changed at the split, then the card lists what changed, and says the numbers are about all of it together', async () => {
    const arms = {
      ...BASE_SETUP,
      id: '5aaaaaaa-3333-4333-8333-333333333333',
      label: 'Camber arms',
      effectiveFrom: '2026-05-20T00:00:00.000Z',
      corners: { ...BASE_SETUP.corners, lf: { ...BASE_SETUP.corners.lf, camberDeg: -2.4, toeMm: 0 }, rf: { ...BASE_SETUP.corners.rf, camberDeg: -2.4, toeMm: 0 } },
    };
    stub({ [`GET ${CAR_PATH}/setups`]: list([QUICK_CHANGE, arms, BASE_SETUP]) });
    renderPage();
    const compare = section('Before and after a change');
    const heading = await compare.findByText('What changed on the car here');
    const card = heading.closest('div.rounded') as HTMLElement;
    expect(heading.textContent).toBe('What changed on the car here (Spring baseline → Camber arms)');
    // The setups' own list of changes: camber and toe at the front, nothing at the rear.
    const lines = within(card).getAllByRole('listitem').map((li) => li.textContent);
    expect(lines).toHaveLength(2);
    expect(lines.find((l) => /camber/i.test(l!))).toMatch(/−1\.20° → −2\.40°/);
    expect(lines.find((l) => /toe/i.test(l!))).toBe('Front toe▲ 0.5 mm(−0.5 mm → 0.0 mm)');
    expect(card.textContent).not.toMatch(/clicks|cold pressure/i);
    expect(within(card).getByText('2 settings changed together: the numbers below are about all of them at once, not any one alone.')).toBeTruthy();
  });

  it('when a side has too few readings, then its change shows no p beside "not enough data yet", and one run says once that it has no spread', async () => {
    const answer = compareAnswer(CHANGE_CAMBER.id, CHANGE_CAMBER.what, 'Camber');
    answer.time = { ...comparison([2, 0.9, 0.2], [1, 0.7, 0], 'Not enough data yet: 2 runs before and 1 after.', false), after: { n: 1, mean: 0.7, sd: null }, pValue: 0.15 };
    stub({ [`GET ${CAR_PATH}/analysis/compare?changeId=${CHANGE_CAMBER.id}`]: jsonResponse(200, answer) });
    renderPage();
    const compare = section('Before and after a change');
    const verdict = await compare.findByText('Not enough data yet: 2 runs before and 1 after.');
    const card = verdict.closest('div.rounded') as HTMLElement;
    expect(card.textContent).not.toMatch(/p = /);
    expect(within(card).getByText(/^0\.70 %/).closest('dd')!.textContent).toBe('0.70 % — no spread with one run (1 run)');
  });

  it('when the setup did not change at the split, then there is no such card', async () => {
    stub();
    renderPage();
    const compare = section('Before and after a change');
    await compare.findByText('Camber: LF inner-edge wear fell by 0.015 mm per run, give or take 0.007.');
    expect(compare.queryByText(/What changed on the car here/)).toBeNull();
  });

  it('when the time comparison shows, then it says which days it comes from, how many runs were left out, and where to judge a change made between events', async () => {
    stub();
    renderPage();
    const compare = section('Before and after a change');
    const verdict = await compare.findByText("Camber: % off the day's best fell by 0.51 %, not enough to rule out chance.");

    const card = verdict.closest('div.rounded') as HTMLElement;
    expect(within(card).getByText(/^From 2 events/).textContent).toBe(
      "From 2 events with runs on both sides of the change, each run against the same driver's best run that day. " +
        '30 clean runs on days wholly before or after it are left out: a change made between events moves the whole day, best run included. ' +
        "Judge a change between events against another car on the same days, such as on the team's class board if this car is entered in a team.",
    );
  });

  it('when no event had runs on both sides of the change, then the time card shows no numbers and says why, with where to judge it', async () => {
    const answer = compareAnswer(CHANGE_CAMBER.id, CHANGE_CAMBER.what, 'Camber', { days: 0, leftOut: 42 });
    const none = { n: 0, mean: null, sd: null };
    answer.time = { ...answer.time, before: none, after: none, difference: null, pValue: null, verdict: 'Not enough data yet: 0 runs before and 0 after.' };
    stub({ [`GET ${CAR_PATH}/analysis/compare?changeId=${CHANGE_CAMBER.id}`]: jsonResponse(200, answer) });
    renderPage();
    const compare = section('Before and after a change');
    await compare.findByText('Camber: LF inner-edge wear fell by 0.015 mm per run, give or take 0.007.');

    const heading = compare.getByText("Time: % off the day's best, per run");
    const card = heading.closest('div.rounded') as HTMLElement;
    expect(card.textContent).toContain('No event had runs on both sides of this change, so its effect on time cannot be measured here');
    expect(card.textContent).toContain("Judge it against another car on the same days, such as on the team's class board");
    // No before and after, no count of runs, no verdict about nothing.
    expect(within(card).queryByText('Before')).toBeNull();
    expect(within(card).queryByText(/\(0 runs\)/)).toBeNull();
    expect(within(card).queryByText(/Not enough data yet/)).toBeNull();
  });

  it('when the screen is narrow, then the corners come one under another, front first, each headed by its name', async () => {
    stub();
    renderPage();
    const compare = section('Before and after a change');
    await compare.findByText('Camber: LF inner-edge wear fell by 0.015 mm per run, give or take 0.007.');

    const wear = within(compare.getByRole('group', { name: 'Tyre wear per run, before and after' }));
    const corners = { 'Left front': 'LF', 'Right front': 'RF', 'Left rear': 'LR', 'Right rear': 'RR' };
    expect(wear.getAllByRole('heading', { level: 3 }).map((h) => h.textContent)).toEqual(Object.keys(corners));
    for (const [name, short] of Object.entries(corners)) {
      expect(wear.getByRole('group', { name }).textContent).toContain(`Camber: ${short} wear barely moved.`);
    }
  });

  it('when the screen is wide, then the corners sit side by side in the car-shaped grid', async () => {
    vi.stubGlobal('matchMedia', (query: string) => ({ matches: query === '(min-width: 48rem)', addEventListener: () => {}, removeEventListener: () => {} }));
    stub();
    renderPage();
    const compare = section('Before and after a change');
    await compare.findByText('Camber: LF inner-edge wear fell by 0.015 mm per run, give or take 0.007.');

    const wear = within(compare.getByRole('group', { name: 'Tyre wear per run, before and after' }));
    expect(wear.queryAllByRole('heading')).toHaveLength(0);
    expect(wear.getByText('▲ Front')).toBeTruthy();
    expect(wear.getByRole('group', { name: 'Right rear' }).textContent).toContain('Camber: RR wear barely moved.');
  });

  it('when another change is picked, then its comparison is fetched and shown', async () => {
    stub({
      [`GET ${CAR_PATH}/analysis/compare?changeId=${CHANGE_FLUID.id}`]: jsonResponse(200, compareAnswer(CHANGE_FLUID.id, CHANGE_FLUID.what, 'Fluid')),
    });
    const u = renderPage();
    const compare = section('Before and after a change');
    await compare.findByText('Camber: RR wear barely moved.');

    await u.selectOptions(compare.getByLabelText('Change to compare across'), CHANGE_FLUID.id);
    expect(await compare.findByText('Fluid: RR wear barely moved.')).toBeTruthy();
  });
});

describe('season review: the dark theme', () => {
  // One point, at the season's fifth event: the series that takes Okabe–Ito blue and the open square, a thin outline.
  const FIFTH_EVENT: ScatterResult = {
    ...CAMBER_TIME,
    points: [point({ x: -1.5, y: 1.2, ...EVENT_B })],
    n: 1,
    fit: null,
    eventIds: [1, 2, 3, 4].map((n) => `e000000${n}-1111-4111-8111-111111111111`).concat(EVENT_B.eventId),
  };
  const systemAsksForDark = (dark: boolean) =>
    vi.stubGlobal('matchMedia', (query: string) => ({ matches: dark && query === '(prefers-color-scheme: dark)', addEventListener: () => {}, removeEventListener: () => {} }));

  it.each([
    ['dark', '#4C8CF5', 'rgb(76, 140, 245)'],
    ['light', '#0072B2', 'rgb(0, 114, 178)'],
  ])('when the system asks for the %s theme, then the blue open square is drawn in %s on the chart and in its key', async (theme, hex, cssColour) => {
    systemAsksForDark(theme === 'dark');
    stub({ [scatterPath('camber', 'time')]: jsonResponse(200, FIFTH_EVENT) });
    renderPage();
    const scatter = section('Setup against time and wear');
    const chart = await scatter.findByRole('img', { name: /Scatter plot of Camber .*, 1 point\./ });

    const [dataset] = chartGiven(chart.getAttribute('aria-label')!).data.datasets;
    expect([dataset!.pointStyle, dataset!.borderColor]).toEqual(['rectRounded', hex]);
    const key = scatter.getByRole('list', { name: 'Series on the chart' });
    expect((within(key).getByText('▢') as HTMLElement).style.color).toBe(cssColour);
  });

  it.each([
    ['light', '#131a24'],
    ['dark', '#E69F00'],
  ])('when the %s theme is on, then the first event’s orange circle is edged in %s: the ink on white, where orange alone is pale', async (theme, edge) => {
    systemAsksForDark(theme === 'dark');
    stub();
    renderPage();
    const chart = await section('Setup against time and wear').findByRole('img', { name: /Scatter plot of Camber/ });

    const [dataset] = chartGiven(chart.getAttribute('aria-label')!).data.datasets;
    expect([dataset!.pointStyle, dataset!.pointBackgroundColor, dataset!.pointBorderColor]).toEqual(['circle', '#E69F00', edge]);
  });
});

describe('season review: the setting plotted first', () => {
  it('when only the rear clicks changed over the season, then the plot opens on rear clicks and never asks for camber', async () => {
    const clicks: ScatterResult = {
      ...CAMBER_TIME,
      x: { param: 'damperClicks', corner: 'rear', unit: 'clicks' },
      points: [point({ x: 10, xNormalized: 0.42, y: 1.1 }), point({ x: 12, xNormalized: 0.5, y: 0.4, ...EVENT_B })],
      fit: null,
    };
    const rearClicks = {
      ...QUICK_CHANGE,
      corners: { ...BASE_SETUP.corners, lr: { ...BASE_SETUP.corners.lr, damperClicks: 12 }, rr: { ...BASE_SETUP.corners.rr, damperClicks: 12 } },
    };
    const fetchMock = stub({
      [`GET ${CAR_PATH}/setups`]: list([rearClicks, BASE_SETUP]),
      [scatterPath('damperClicks', 'time', 'rear')]: jsonResponse(200, clicks),
    });
    renderPage();
    const scatter = section('Setup against time and wear');

    await scatter.findByRole('img', { name: /Scatter plot of Damper clicks against/ });
    expect((scatter.getByLabelText('Setting (x)') as HTMLSelectElement).value).toBe('damperClicks');
    expect((scatter.getByLabelText('Where') as HTMLSelectElement).value).toBe('rear');
    expect(requestsTo(fetchMock, scatterPath('camber', 'time'))).toHaveLength(0);
  });
});

describe('season review: before and after a new setup', () => {
  it('when the list is opened, then the log’s changes and each new setup are offered newest first, and a quick change is compared at the moment it took effect', async () => {
    const at = `GET ${CAR_PATH}/analysis/compare?at=${encodeURIComponent(QUICK_CHANGE.effectiveFrom)}`;
    const fetchMock = stub({ [at]: jsonResponse(200, compareAnswer(QUICK_CHANGE.id, QUICK_CHANGE.label, 'Clicks')) });
    const u = renderPage();
    const compare = section('Before and after a change');
    await compare.findByText('Camber: RR wear barely moved.');

    const picker = compare.getByLabelText('Change to compare across') as HTMLSelectElement;
    // The first snapshot is what the season started on, not a change.
    expect([...picker.options].map((o) => o.textContent)).toEqual([
      expect.stringMatching(/· Setup: Quick change: rear clicks \+2$/),
      expect.stringMatching(/· Fresh brake fluid \(/),
      expect.stringMatching(/· Front camber −1\.5° → −2\.0° \(/),
    ]);
    await u.selectOptions(picker, `setup:${QUICK_CHANGE.id}`);
    expect(await compare.findByText('Clicks: RR wear barely moved.')).toBeTruthy();
    expect(requestsTo(fetchMock, at)).toHaveLength(1);
  });

  it('when the log is empty and the car has one setup, then it says what to do for a comparison', async () => {
    stub({ [`GET ${CAR_PATH}/changes`]: list([]), [`GET ${CAR_PATH}/setups`]: list([BASE_SETUP]) });
    renderPage();
    expect(await section('Before and after a change').findByText(/Nothing to compare yet/)).toBeTruthy();
  });
});

describe('season review: tyre life', () => {
  it('when the season answers, then each set shows its worst spot and runs left, and "not enough readings yet" where there is no rate', async () => {
    stub();
    renderPage();
    const life = section('Tyre life');

    const setA = within(await life.findByRole('article', { name: 'Set A — 205/50R15' }));
    expect(setA.getByText('Left front, inner edge: 3.2 mm', { exact: false })).toBeTruthy();
    expect(setA.getByText('0.050 mm per run')).toBeTruthy();
    expect(setA.getByText('Runs left to 1.6 mm:')).toBeTruthy();
    expect(setA.getByText('about 32 runs (a straight-line estimate)')).toBeTruthy();
    expect(setA.getByText(/^4 readings, r² = 0\.97/)).toBeTruthy();

    const setB = within(life.getByRole('article', { name: 'Set B — fresh' }));
    expect(setB.getAllByText('not enough readings yet')).toHaveLength(2);
    expect(life.getByRole('complementary', { name: 'Tread depth' }).textContent).toMatch(/1\.6 mm \(2\/32 in\)/);
  });

  it('when the alignment at the worst corner changed on a set, then the card says where its line starts, or that too few readings followed', async () => {
    const answer = season(1.6, 32);
    answer.tyreLife = [
      tyreLife({ tyreSetId: IDS.tyreSet, label: 'Set A — 205/50R15', alignmentChange: { at: '2026-06-20T08:00:00.000Z', label: 'Camber arms', fitted: 'since' } }),
      tyreLife({ tyreSetId: 'f2222222-2222-4222-8222-222222222222', label: 'Set B — fresh', alignmentChange: { at: '2026-07-04T08:00:00.000Z', label: 'Toe out 1 mm', fitted: 'whole' } }),
      tyreLife({ tyreSetId: 'f3333333-3333-4333-8333-333333333333', label: 'Set C — spare', worst: null, mmPerRun: null, alignmentChange: null }),
    ];
    stub({ [`GET ${CAR_PATH}/season?minDepthMm=1.6`]: jsonResponse(200, answer) });
    renderPage();
    const life = section('Tyre life');

    const setA = await life.findByRole('article', { name: 'Set A — 205/50R15' });
    expect(within(setA).getByText(/^The alignment at the left front changed on/).textContent).toBe(
      `The alignment at the left front changed on ${formatDay('2026-06-20T08:00:00.000Z')} (Camber arms): the line starts at the last reading before it, so the rate is the one since.`,
    );
    const setB = life.getByRole('article', { name: 'Set B — fresh' });
    expect(within(setB).getByText(/^The alignment at the left front changed on/).textContent).toMatch(/too few readings have been taken since: the line goes through every reading/);
    expect(within(life.getByRole('article', { name: 'Set C — spare' })).queryByText(/alignment/)).toBeNull();
  });

  it('when runs were made on a set since its latest reading, then runs left says how many it took off, and asks for a new reading', async () => {
    const answer = season(1.6, 24);
    answer.tyreLife = [tyreLife({ tyreSetId: IDS.tyreSet, label: 'Set A — 205/50R15', runsLeft: 24, runsSinceReading: 5 })];
    stub({ [`GET ${CAR_PATH}/season?minDepthMm=1.6`]: jsonResponse(200, answer) });
    renderPage();
    const setA = within(await section('Tyre life').findByRole('article', { name: 'Set A — 205/50R15' }));
    expect(setA.getByText(/^about 24 runs/).closest('dd')!.textContent).toBe(
      'about 24 runs (a straight-line estimate) — after the 5 runs made on this set since the reading. Read the tread again to check.',
    );
  });

  it('when a new minimum depth is entered, then the season is fetched again with it and runs left follow', async () => {
    const fetch = stub({ [`GET ${CAR_PATH}/season?minDepthMm=3`]: jsonResponse(200, season(3, 4)) });
    const u = renderPage();
    const life = section('Tyre life');
    await life.findByText('about 32 runs (a straight-line estimate)');

    const input = life.getByLabelText('Retire the tyre at');
    await u.clear(input);
    await u.type(input, '3');
    await u.click(life.getByRole('button', { name: 'Recalculate' }));

    expect(await life.findByText('about 4 runs (a straight-line estimate)')).toBeTruthy();
    expect(life.getAllByText('Runs left to 3.0 mm:')).toHaveLength(2);
    expect(requestsTo(fetch, `GET ${CAR_PATH}/season?minDepthMm=3`)).toHaveLength(1);
  });

  it('when the minimum is not a depth, then the field says so and nothing is fetched', async () => {
    const fetch = stub();
    const u = renderPage();
    const life = section('Tyre life');
    await life.findByText('about 32 runs (a straight-line estimate)');

    const input = life.getByLabelText('Retire the tyre at');
    await u.clear(input);
    await u.type(input, '12');
    await u.click(life.getByRole('button', { name: 'Recalculate' }));

    expect(life.getByText('Enter a depth from 0.0 mm to 10.0 mm')).toBeTruthy();
    expect(fetch.mock.calls.filter(([url]) => String(url).includes('/season?'))).toHaveLength(1);
  });
});

describe('season review: timeline', () => {
  it('when the season has setup changes, then the chart marks them and they are listed in order with their diffs', async () => {
    stub();
    renderPage();
    const timeline = section('Season timeline');

    const chart = await timeline.findByRole('img', { name: /Best adjusted time per event/ });
    expect(chart.textContent).toBe('Maren Holt: 2; Tomas Reyes: 1; Setup change: 2; Change-log entry: 2');
    expect(timeline.getByText(/Courses differ from event to event/)).toBeTruthy();

    const ordered = timeline.getByRole('heading', { name: 'Setup changes, in order' }).nextElementSibling as HTMLElement;
    const items = within(ordered).getAllByRole('listitem').filter((li) => li.parentElement === ordered);
    expect(items[0]!.textContent).toMatch(/Baseline.*the starting point/);
    expect(items[1]!.textContent).toMatch(/More camber/);
    expect(within(items[1]!).getByText('0.50° more negative')).toBeTruthy();
  });

  it('when the timeline is shown as a table, then each time sits on its own line above its runs and cones', async () => {
    stub();
    const u = renderPage();
    const timeline = section('Season timeline');
    await timeline.findByRole('img', { name: /Best adjusted time per event/ });
    await u.click(timeline.getByRole('button', { name: 'Show as table' }));

    const box = await timeline.findByRole('region', { name: 'Best adjusted time per event (courses differ between events)' });
    const round3 = within(box).getByRole('row', { name: /Harrow Flats — Round 3/ });
    const maren = within(round3).getAllByRole('cell')[0]!;
    expect([...maren.children].map((line) => line.textContent)).toEqual(['48.100 s', '4 runs, 1 cone']);
  });
});

describe('season review of a car that is not there', () => {
  it.each([404, 403])('when the car answers %i (gone, or not shared), then the page says once that the car was not found and offers the way back, not a section that failed', async (status) => {
    stub({ [`GET ${CAR_PATH}`]: jsonResponse(status, { error: { code: status === 404 ? 'not_found' : 'forbidden', message: 'That car was not found.' } }) });
    renderPage();

    expect(await screen.findByRole('heading', { name: 'Car not found' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Back to your cars' }).getAttribute('href')).toBe('/cars');
    expect(screen.queryByRole('heading', { name: 'Season review' })).toBeNull();
    expect(screen.queryByText(/could not be loaded/)).toBeNull();
  });
});
