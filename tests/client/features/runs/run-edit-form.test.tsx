// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES, type UnitPreferences } from '../../../../shared/calc/units.calc';
import type { Run } from '../../../../shared/season/run.schema';
import { RunEditForm, type RunChanges } from '@/features/runs/components/run-edit-form';
import type { RunRow } from '@/features/runs/utils/merge-runs';
import { UnitsProvider } from '@/lib/units-context';
import { IDS, savedRun } from '../../fixtures/season';

afterEach(cleanup);

const rowOf = (run: Partial<Run> = {}): RunRow => ({ ...savedRun({ id: IDS.run1, runNumber: 2, rawTimeSec: 45.5, ...run }), pending: null });

/** The edit form of one saved run, in the driver's units; what it would save is caught. */
function renderForm(
  row: RunRow,
  { units = METRIC_PREFERENCES, serverErrors, numberTaken }: { units?: UnitPreferences; serverErrors?: Record<string, string[]>; numberTaken?: boolean } = {},
) {
  const onSubmit = vi.fn<(changes: RunChanges) => void>();
  render(
    <UnitsProvider units={units}>
      <RunEditForm
        row={row}
        takenNumbers={[1]}
        serverErrors={serverErrors}
        numberTaken={numberTaken}
        submitLabel="Save changes"
        onSubmit={onSubmit}
        onCancel={() => undefined}
      />
    </UnitsProvider>,
  );
  return { onSubmit, u: userEvent.setup() };
}

const field = (name: string) => screen.getByLabelText(name) as HTMLInputElement;

describe('run edit form: run number', () => {
  it.each([
    ['a hyphen', '-3'],
    ['a minus sign (U+2212)', '\u22123'],
  ])('when the run number is typed with %s, then the minus stays in the field and the number is refused at the field, not saved as 3', async (_name, typed) => {
    const { onSubmit, u } = renderForm(rowOf());
    await u.clear(field('Run number'));
    await u.type(field('Run number'), typed);
    expect(field('Run number').value).toBe(typed);

    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    expect(onSubmit).not.toHaveBeenCalled();
    expect(field('Run number').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByText('Run numbers start at 1')).toBeTruthy();
  });

  it('when the server refused the number as taken, then the next free one is offered; refused for another reason, the number stays with the server’s words', async () => {
    renderForm(rowOf(), { serverErrors: { runNumber: ['Run 2 is already logged; use the next number'] }, numberTaken: true });
    expect(field('Run number').value).toBe('3');
    cleanup();

    renderForm(rowOf(), { serverErrors: { runNumber: ['Run numbers start at 1'] } });
    expect(field('Run number').value).toBe('2');
    expect(screen.getByText('Run numbers start at 1')).toBeTruthy();
  });

  it('when the run number is 0, has a decimal point or is already taken, then each is refused at the field', async () => {
    const { onSubmit, u } = renderForm(rowOf());
    for (const [typed, message] of [
      ['0', 'Run numbers are whole numbers from 1 to 999'],
      ['2.5', 'Run numbers are whole numbers from 1 to 999'],
      ['1', 'Run 1 is already logged for Maren Holt'],
    ]) {
      await u.clear(field('Run number'));
      await u.type(field('Run number'), typed!);
      await u.click(screen.getByRole('button', { name: 'Save changes' }));
      expect(screen.getByText(message!)).toBeTruthy();
    }
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('when a negative time is typed, with either minus sign, then it is refused at the field, not saved without its sign', async () => {
    const { onSubmit, u } = renderForm(rowOf());
    for (const typed of ['-45.5', '\u221245.5']) {
      await u.clear(field('Raw time'));
      await u.type(field('Raw time'), typed);
      expect(field('Raw time').value).toBe(typed);
      await u.click(screen.getByRole('button', { name: 'Save changes' }));
      expect(screen.getByText('A time cannot be negative')).toBeTruthy();
    }
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('when the time is emptied, then a finished run is refused with the way out, and as a DNF it saves with no time', async () => {
    const { onSubmit, u } = renderForm(rowOf());
    await u.clear(field('Raw time'));
    await u.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(screen.getByText('Enter the time, or choose DNF or Off course. Type the time as 45.678 or 1:05.432')).toBeTruthy();
    expect(onSubmit).not.toHaveBeenCalled();

    await u.click(screen.getByRole('radio', { name: 'DNF' }));
    await u.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(onSubmit).toHaveBeenCalledWith(expect.objectContaining({ rawTimeSec: null, status: 'dnf' }));
  });

  it('when a new run number is typed, then it is saved with every other field as it was', async () => {
    const { onSubmit, u } = renderForm(rowOf({ cones: 1, notes: 'Late turn-in' }));
    await u.clear(field('Run number'));
    await u.type(field('Run number'), '3');
    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    expect(onSubmit).toHaveBeenCalledWith({ runNumber: 3, rawTimeSec: 45.5, cones: 1, status: 'finished', notes: 'Late turn-in' });
  });
});

describe('run edit form: hot pressures', () => {
  const SAVED_HOT = { lf: 250, rf: 252, lr: 240, rr: 241 };

  it('when the run has hot pressures, then each corner shows in the driver’s unit', () => {
    // 1 psi = 6.894 757 293 168 kPa (NIST SP 811), worked by hand: 250 kPa = 36.26 psi → "36.3"; 241 kPa = 34.95 psi → "35.0".
    renderForm(rowOf({ hotPressuresKpa: SAVED_HOT }), { units: IMPERIAL_PREFERENCES });
    expect(screen.getByRole('group', { name: 'Hot pressures (psi)' })).toBeTruthy();
    expect(field('Left front hot pressure').value).toBe('36.3');
    expect(field('Right rear hot pressure').value).toBe('35.0');
  });

  it('when one corner is changed in psi, then the whole set is saved in kPa, the other corners exactly as they were', async () => {
    const { onSubmit, u } = renderForm(rowOf({ hotPressuresKpa: SAVED_HOT, notes: 'Hot lap' }), { units: IMPERIAL_PREFERENCES });
    await u.clear(field('Left front hot pressure'));
    await u.type(field('Left front hot pressure'), '37');
    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    expect(onSubmit).toHaveBeenCalledTimes(1);
    const changes = onSubmit.mock.calls[0]![0];
    expect(changes).toMatchObject({ runNumber: 2, rawTimeSec: 45.5, cones: 0, status: 'finished', notes: 'Hot lap' });
    // 37 psi × 6.894 757 293 168 = 255.106 kPa (NIST SP 811, worked by hand); 252 kPa shown as 36.5 psi is not sent back
    // as 36.5 × 6.8948 = 251.66 kPa.
    expect(changes.hotPressuresKpa?.lf).toBeCloseTo(255.106, 3);
    expect(changes.hotPressuresKpa).toMatchObject({ rf: 252, lr: 240, rr: 241 });
  });

  it('when one corner is emptied, then the set is saved without it; when all four are emptied, then null clears them', async () => {
    const { onSubmit, u } = renderForm(rowOf({ hotPressuresKpa: SAVED_HOT }));
    await u.clear(field('Right rear hot pressure'));
    await u.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(onSubmit.mock.calls[0]![0].hotPressuresKpa).toEqual({ lf: 250, rf: 252, lr: 240 });

    for (const corner of ['Left front', 'Right front', 'Left rear']) await u.clear(field(`${corner} hot pressure`));
    await u.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(onSubmit.mock.calls[1]![0].hotPressuresKpa).toBeNull();
  });

  it('when no hot pressure is touched, then the save carries none, and the saved ones stay as they are', async () => {
    const { onSubmit, u } = renderForm(rowOf({ hotPressuresKpa: SAVED_HOT }));
    await u.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(onSubmit.mock.calls[0]![0]).not.toHaveProperty('hotPressuresKpa');
  });

  it('when the run had none and one is typed, then the set holds that corner alone', async () => {
    const { onSubmit, u } = renderForm(rowOf());
    await u.type(field('Left rear hot pressure'), '231');
    await u.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(onSubmit.mock.calls[0]![0].hotPressuresKpa).toEqual({ lr: 231 });
  });

  it('when a hot pressure is negative (with either minus sign), not a number or above 450 kPa, then that corner says so, keeps what was typed, and nothing is saved', async () => {
    const { onSubmit, u } = renderForm(rowOf({ hotPressuresKpa: SAVED_HOT, notes: 'Hot lap' }));
    const typed = { 'Left front': '-250', 'Right front': '\u2212250', 'Left rear': '2x', 'Right rear': '500' };
    for (const [corner, text] of Object.entries(typed)) {
      await u.clear(field(`${corner} hot pressure`));
      await u.type(field(`${corner} hot pressure`), text);
    }
    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    expect(onSubmit).not.toHaveBeenCalled();
    for (const [corner, text] of Object.entries(typed)) {
      expect(field(`${corner} hot pressure`).value).toBe(text);
      expect(field(`${corner} hot pressure`).getAttribute('aria-invalid')).toBe('true');
    }
    expect(screen.getAllByText('Between 50 kPa and 450 kPa')).toHaveLength(3);
    expect(screen.getByText('Type a number, e.g. 224 kPa')).toBeTruthy();
    // The other fields keep what they hold.
    expect(field('Note').value).toBe('Hot lap');
    expect(field('Raw time').value).toBe('45.500');
  });

  it('when the server refused a corner’s hot pressure, then its message shows at that corner', () => {
    renderForm(rowOf({ hotPressuresKpa: SAVED_HOT }), { serverErrors: { 'hotPressuresKpa.rr': ['Pressure must be at most 450 kPa'] } });
    expect(field('Right rear hot pressure').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByText('Pressure must be at most 450 kPa')).toBeTruthy();
  });
});
