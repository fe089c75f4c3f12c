// @vitest-environment jsdom
import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import {
  BUILD_SHEET_FIELDS,
  type BuildSheetCorner,
  type BuildSheetCornerChecks,
  type WorkOrder,
} from '../../../../shared/service/work-order.schema';
import { jsonResponse, renderApp, setUpAppTests } from '../../test-utils';
import { stubDriver, stubStaff, WO, WORK_ORDER_PATH, workOrder } from './service-fixtures';

setUpAppTests([() => import('@/app/routes/work-orders/work-order')]);

const blank = (): BuildSheetCorner => Object.fromEntries(BUILD_SHEET_FIELDS.map((f) => [f, null])) as BuildSheetCorner;
const noChecks = (): BuildSheetCornerChecks => ({ compressedLength: null, droop: null, bumpTravelAtWheelMm: null, problems: [] });

/**
 * An invented coilover build: the left front is 20 mm shorter than the reference (the shop allows 15 mm) and its main
 * spring lifts off at full droop; the right rear passes both; the right front was saved with every box empty and the
 * left rear never saved.
 */
function coiloverVisit(): WorkOrder {
  const base = workOrder();
  return {
    ...base,
    shop: { ...base.shop, compressedLengthToleranceMm: 15 },
    buildSheet: {
      motionRatio: { front: 0.9, rear: 0.7 },
      corners: {
        lf: { ...blank(), damperCompressedLengthMm: 330, referenceCompressedLengthMm: 350 },
        rf: blank(),
        lr: null,
        rr: { ...blank(), damperCompressedLengthMm: 345, referenceCompressedLengthMm: 350 },
      },
      checks: {
        lf: {
          ...noChecks(),
          compressedLength: { differenceMm: -20, withinTolerance: false },
          droop: { staticCompressionMm: 30, droopAtSpringMm: 42, seated: false, shortfallMm: 12 },
        },
        rf: noChecks(),
        lr: null,
        rr: { ...noChecks(), compressedLength: { differenceMm: -5, withinTolerance: true } },
      },
    },
  };
}

/** Whether an element sits inside something hidden on paper. */
const hiddenInPrint = (el: Element) => Boolean(el.closest('.print\\:hidden'));

describe('the build sheet checks', () => {
  it('when the corner whose main spring lifts off has a helper spring written on it, then the warning asks whether that helper covers the gap', async () => {
    const visit = coiloverVisit();
    visit.buildSheet.corners.lf = { ...visit.buildSheet.corners.lf!, helperSpringRateNPerMm: 10, helperSpringFreeLengthMm: 60 };
    stubDriver({ [`GET ${WO}`]: jsonResponse(200, visit) });
    renderApp(WORK_ORDER_PATH);
    const grid = await screen.findByRole('group', { name: 'Build sheet, per corner' });

    const lfChecks = within(within(grid).getByRole('group', { name: 'Left front' })).getByRole('list', { name: 'Checks' });
    expect(within(lfChecks).getAllByRole('listitem')[1]!.textContent).toBe(
      "Warning: Main spring comes off its seat at full droop by 12.0 mm: the helper spring listed holds it only if it has at least 12.0 mm of travel (its maker's figure); else limit the droop.",
    );
  });

  it('when a corner fails its compressed-length and droop checks, then those lines read as warnings with an icon while a passing line stays plain', async () => {
    stubDriver({ [`GET ${WO}`]: jsonResponse(200, coiloverVisit()) });
    renderApp(WORK_ORDER_PATH);
    const grid = await screen.findByRole('group', { name: 'Build sheet, per corner' });

    const lfChecks = within(within(grid).getByRole('group', { name: 'Left front' })).getByRole('list', { name: 'Checks' });
    const failed = within(lfChecks).getAllByRole('listitem');
    expect(failed.map((li) => li.textContent)).toEqual([
      'Warning: Compressed length: 20.0 mm shorter than the reference — more than 15.0 mm shorter: the wheel could travel into the body. Check clearances.',
      'Warning: Main spring comes off its seat at full droop: a helper spring needs 12.0 mm of travel, or limit the droop.',
    ]);
    for (const li of failed) {
      expect(li.className).toContain('text-warning');
      expect(li.querySelector('svg[aria-hidden="true"]')).not.toBeNull();
    }

    const rrLine = within(within(within(grid).getByRole('group', { name: 'Right rear' })).getByRole('list', { name: 'Checks' })).getByRole('listitem');
    expect(rrLine.textContent).toBe('Compressed length: 5.0 mm shorter than the reference — within the shop’s 15.0 mm tolerance.');
    expect(rrLine.className).not.toContain('text-warning');
    expect(rrLine.querySelector('svg')).toBeNull();
  });

  it('when the handover sheet is printed, then the failed checks are on it as warnings', async () => {
    stubStaff(METRIC_PREFERENCES, { [`GET ${WO}`]: jsonResponse(200, coiloverVisit()) });
    renderApp(WORK_ORDER_PATH);
    // The table is what paper shows (the per-corner grid is for phones).
    const table = await screen.findByRole('table', { name: 'Build sheet' });
    const printed = table.parentElement!;
    expect(hiddenInPrint(printed)).toBe(false);
    const warnings = within(printed)
      .getAllByRole('listitem')
      .filter((li) => li.textContent!.startsWith('Warning: '));
    expect(warnings.map((li) => li.textContent)).toEqual([
      expect.stringContaining('20.0 mm shorter than the reference'),
      expect.stringContaining('Main spring comes off its seat at full droop'),
    ]);
    // The word "Warning" is printed as well as read out, for a printer without colour.
    for (const li of warnings) expect(within(li).getByText('Warning:').className).toContain('print:not-sr-only');
  });
});

describe('empty build sheet corners', () => {
  it('when a corner was saved empty or never saved, then the phone grid and the printed sheet both say "Not filled in."', async () => {
    stubStaff(METRIC_PREFERENCES, { [`GET ${WO}`]: jsonResponse(200, coiloverVisit()) });
    renderApp(WORK_ORDER_PATH);
    const grid = await screen.findByRole('group', { name: 'Build sheet, per corner' });
    for (const name of ['Right front', 'Left rear']) {
      expect(within(grid).getByRole('group', { name }).textContent).toContain('Not filled in.');
    }

    const printed = screen.getByRole('table', { name: 'Build sheet' }).parentElement!;
    const line = (corner: string) => within(printed).getByText(`${corner}:`).parentElement!.textContent;
    expect(line('Right front')).toBe('Right front:Not filled in.');
    expect(line('Left rear')).toBe('Left rear:Not filled in.');
  });

  it('when every corner was saved empty, then the page says there is no build sheet', async () => {
    const visit = workOrder();
    stubDriver({
      [`GET ${WO}`]: jsonResponse(
        200,
        workOrder({ buildSheet: { ...visit.buildSheet, corners: { lf: blank(), rf: blank(), lr: blank(), rr: blank() }, checks: { lf: noChecks(), rf: noChecks(), lr: noChecks(), rr: noChecks() } } }),
      ),
    });
    renderApp(WORK_ORDER_PATH);
    expect(await screen.findByText('No build sheet for this visit.')).toBeTruthy();
    expect(screen.queryByRole('table', { name: 'Build sheet' })).toBeNull();
  });
});
