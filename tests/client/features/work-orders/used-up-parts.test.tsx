// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import type { ReplaceLinesInput, WorkOrderLine } from '../../../../shared/service/work-order.schema';
import { jsonResponse, renderApp, requestsTo, setUpAppTests } from '../../test-utils';
import { stubDriver, stubStaff, WO, WORK_ORDER_PATH, workOrder } from './service-fixtures';

const PUT = `PUT ${WO}/lines`;

setUpAppTests([() => import('@/app/routes/work-orders/work-order')]);

const FLUID: WorkOrderLine = { kind: 'part', description: 'Brake fluid, 1 l', quantity: 1, unitPriceCents: 1800, usedUp: true, totalCents: 1800 };
const ARM: WorkOrderLine = { kind: 'part', description: 'Rear toe arm', quantity: 2, unitPriceCents: 9900, usedUp: false, totalCents: 19800 };
const WITH_FLUID = { lines: [ARM, FLUID], totals: { partsCents: 21600, labourCents: 0, subtotalCents: 21600 } };

/** The choice on one line of the form: a group of two radio buttons. */
const partUse = (line: HTMLElement) => within(line).getByRole('group', { name: 'After the work, this part is' });

describe('whether a part stays on the car', () => {
  it('when staff add a part, then it stays on the car unless they choose "Used up in the work" (by keyboard here), which is sent; labour has no such choice', async () => {
    const fetchMock = stubStaff(METRIC_PREFERENCES, { [PUT]: jsonResponse(200, workOrder({ version: 2 })) });
    renderApp(WORK_ORDER_PATH);
    const u = userEvent.setup();
    await u.click(await screen.findByRole('button', { name: 'Add a part' }));
    const fluid = screen.getByRole('group', { name: 'Line 1' });
    const stays = within(partUse(fluid)).getByRole('radio', { name: 'Stays on the car' });
    const usedUp = within(partUse(fluid)).getByRole('radio', { name: 'Used up in the work' });
    expect((stays as HTMLInputElement).checked).toBe(true);
    expect((usedUp as HTMLInputElement).checked).toBe(false);
    // Each choice is explained to a screen reader, not only by its look.
    expect(usedUp.getAttribute('aria-describedby')).toBeTruthy();
    expect(document.getElementById(usedUp.getAttribute('aria-describedby')!)?.textContent).toMatch(/billed only/);
    await u.type(within(fluid).getByLabelText('Description'), 'Brake fluid');
    await u.type(within(fluid).getByLabelText('Price each'), '18');
    // By keyboard: the choices are real radio buttons, so Space on one chooses it.
    usedUp.focus();
    await u.keyboard(' ');
    expect((usedUp as HTMLInputElement).checked).toBe(true);
    expect((stays as HTMLInputElement).checked).toBe(false);
    // One example under the two choices, the chosen one's, so the choice stays short on a phone.
    const shown = () => [...partUse(fluid).querySelectorAll('p')].filter((p) => !p.hidden).map((p) => p.textContent);
    expect(shown()).toEqual(['Like brake fluid, thread locker or shop supplies: billed only.']);
    await u.click(stays);
    expect(shown()).toEqual(['Fitted, like arms or springs: it goes into the car’s change log.']);
    usedUp.focus();
    await u.keyboard(' ');

    await u.click(screen.getByRole('button', { name: 'Add a part' }));
    const arm = screen.getByRole('group', { name: 'Line 2' });
    await u.type(within(arm).getByLabelText('Description'), 'Toe arm');
    await u.type(within(arm).getByLabelText('Price each'), '99');
    await u.click(screen.getByRole('button', { name: 'Add labour' }));
    const labour = screen.getByRole('group', { name: 'Line 3' });
    expect(within(labour).queryByRole('radio')).toBeNull();
    await u.type(within(labour).getByLabelText('Description'), 'Bleed');
    await u.type(within(labour).getByLabelText('Hours'), '1');
    await u.type(within(labour).getByLabelText('Rate per hour'), '95');
    await u.click(screen.getByRole('button', { name: 'Save parts and labour' }));

    await waitFor(() => expect(requestsTo(fetchMock, PUT)).toHaveLength(1));
    expect((requestsTo(fetchMock, PUT)[0]!.body as ReplaceLinesInput).lines).toEqual([
      { kind: 'part', description: 'Brake fluid', quantity: 1, unitPriceCents: 1800, usedUp: true },
      { kind: 'part', description: 'Toe arm', quantity: 1, unitPriceCents: 9900, usedUp: false },
      { kind: 'labour', description: 'Bleed', quantity: 1, unitPriceCents: 9500 },
    ]);
  }, 15_000);

  it('when a visit already has a used-up part, then the form shows it chosen and a save sends it back unchanged', async () => {
    const fetchMock = stubStaff(METRIC_PREFERENCES, { [`GET ${WO}`]: jsonResponse(200, workOrder(WITH_FLUID)), [PUT]: jsonResponse(200, workOrder({ ...WITH_FLUID, version: 2 })) });
    renderApp(WORK_ORDER_PATH);
    const u = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Parts and labour' });
    const used = (name: string) =>
      (within(partUse(within(form).getByRole('group', { name }))).getByRole('radio', { name: 'Used up in the work' }) as HTMLInputElement).checked;
    expect(used('Line 1')).toBe(false);
    expect(used('Line 2')).toBe(true);
    await u.click(within(form).getByRole('button', { name: 'Save parts and labour' }));
    await waitFor(() => expect(requestsTo(fetchMock, PUT)).toHaveLength(1));
    expect((requestsTo(fetchMock, PUT)[0]!.body as ReplaceLinesInput).lines.map((l) => [l.description, l.usedUp])).toEqual([
      ['Rear toe arm', false],
      ['Brake fluid, 1 l', true],
    ]);
  });

  it('when the driver reads the handover sheet, then a used-up part is labelled so and a fitted one is not', async () => {
    stubDriver({ [`GET ${WO}`]: jsonResponse(200, workOrder({ ...WITH_FLUID, status: 'closed', handoverAt: '2026-06-10T16:30:00.000Z' })) });
    renderApp(WORK_ORDER_PATH);
    const table = await screen.findByRole('table', { name: 'Parts and labour' });
    expect(within(table).getByRole('row', { name: /Brake fluid/ }).textContent).toContain('used up in the work');
    expect(within(table).getByRole('row', { name: /Rear toe arm/ }).textContent).not.toContain('used up');
    expect(screen.getByText(/the car’s change log lists only the parts fitted/)).toBeTruthy();
  });
});
