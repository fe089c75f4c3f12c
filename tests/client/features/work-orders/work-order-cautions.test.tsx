// @vitest-environment jsdom
import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { errorResponse, jsonResponse, renderApp, setUpAppTests } from '../../test-utils';
import { SERVICE_IDS, stubDriver, stubStaff, WO, WORK_ORDER_PATH, workOrder } from './service-fixtures';

setUpAppTests([() => import('@/app/routes/work-orders/work-order')]);

/** Whether an element sits inside something hidden on paper. */
const hiddenInPrint = (el: Element) => Boolean(el.closest('.print\\:hidden'));

describe('safety cautions on a work order', () => {
  it('when staff open the measurements, then a caution beside them covers axle stands, torque figures and cold pressures', async () => {
    stubStaff(METRIC_PREFERENCES);
    renderApp(WORK_ORDER_PATH);
    const section = await screen.findByRole('region', { name: 'Measurements' });
    const caution = within(section).getByRole('complementary', { name: 'Caution' });
    const text = caution.textContent!;
    expect(text).toMatch(/jack alone/);
    expect(text).toMatch(/axle stands on firm, level ground/);
    expect(text).toMatch(/torque figures/);
    expect(text).toMatch(/cold tyre pressures/i);
  });

  it('when the driver reads a closed visit, then the handover sheet tells them what to check before driving, and it prints', async () => {
    stubDriver({
      [`GET ${WO}`]: jsonResponse(200, workOrder({ status: 'closed', handoverAt: '2026-06-10T16:30:00.000Z', setupId: SERVICE_IDS.newSetup })),
      [`GET ${WO}/invoice`]: errorResponse(404, 'not_found', 'There is no invoice for this work order yet.'),
    });
    renderApp(WORK_ORDER_PATH);
    const caution = await screen.findByRole('complementary', { name: 'Before you drive' });
    const text = caution.textContent!;
    expect(text).toMatch(/wheel nuts’ torque again after the first short drive/);
    expect(text).toMatch(/cold tyre pressures/i);
    expect(text).toMatch(/Drive gently at first/);
    expect(text).toMatch(/event’s rules/);
    expect(hiddenInPrint(caution)).toBe(false);
  });
});
