// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { METRIC_PREFERENCES, type UnitPreferences } from '../../../../shared/calc/units.calc';
import type { Run } from '../../../../shared/season/run.schema';
import { RunEditForm, type RunChanges } from '@/features/runs/components/run-edit-form';
import type { RunRow } from '@/features/runs/utils/merge-runs';
import { UnitsProvider } from '@/lib/units-context';
import { IDS, savedRun } from '../../fixtures/season';

afterEach(cleanup);

const rowOf = (run: Partial<Run> = {}): RunRow => ({ ...savedRun({ id: IDS.run1, runNumber: 2, rawTimeSec: 45.5, ...run }), pending: null });

/** The edit form of one saved run, in the driver's units; what it would save is caught. */
function renderForm(row: RunRow, { units = METRIC_PREFERENCES, serverErrors }: { units?: UnitPreferences; serverErrors?: Record<string, string[]> } = {}) {
  const onSubmit = vi.fn<(changes: RunChanges) => void>();
  render(
    <UnitsProvider units={units}>
      <RunEditForm row={row} takenNumbers={[1]} serverErrors={serverErrors} submitLabel="Save changes" onSubmit={onSubmit} onCancel={() => undefined} />
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

  it('when the run number is 0, has a decimal point or is already taken, then each is refused at the field', async () => {
    const { onSubmit, u } = renderForm(rowOf());
    for (const [typed, message] of [
      ['0', 'A whole number from 1 to 999'],
      ['2.5', 'A whole number from 1 to 999'],
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

  it('when a new run number is typed, then it is saved with every other field as it was', async () => {
    const { onSubmit, u } = renderForm(rowOf({ cones: 1, notes: 'Late turn-in' }));
    await u.clear(field('Run number'));
    await u.type(field('Run number'), '3');
    await u.click(screen.getByRole('button', { name: 'Save changes' }));

    expect(onSubmit).toHaveBeenCalledWith({ runNumber: 3, rawTimeSec: 45.5, cones: 1, status: 'finished', notes: 'Late turn-in' });
  });
});
