// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import { intlFormat } from 'date-fns';
import { afterEach, describe, expect, it } from 'vitest';
import { CurrentSetup } from '@/features/setups/components/current-setup';
import type { SetupView } from '@/features/setups/utils/setup-views';

afterEach(cleanup);

// Local time, as a driver's phone shows it.
const startedAt = new Date(2026, 8, 20, 10, 11).toISOString();
const setup = { id: 's1', label: 'Quick change: rear cold pressure −7 kPa', effectiveFrom: startedAt, pending: null } as unknown as SetupView;
// date-fns, an independent library, spells out what the line should read.
const clock = intlFormat(new Date(startedAt), { hour: '2-digit', minute: '2-digit' });
const day = intlFormat(new Date(startedAt), { day: 'numeric', month: 'short', year: 'numeric' });

describe('the setup line on the trackside page', () => {
  it('when the setup was made on the event\'s day, then it says only the time it started', () => {
    render(<CurrentSetup setup={setup} day="2026-09-20" />);
    expect(screen.getByText(`since ${clock}`)).toBeTruthy();
    expect(screen.queryByText(new RegExp(day))).toBeNull();
  });

  it('when it was made on another day, then it says the day as well', () => {
    render(<CurrentSetup setup={setup} day="2026-09-21" />);
    expect(screen.getByText(`since ${day}, ${clock}`)).toBeTruthy();
  });

  it('when the setup is a quick change, then the line starts with what changed, not the words the Quick change button beside it already says', () => {
    render(<CurrentSetup setup={setup} day="2026-09-20" />);
    expect(screen.getByText('rear cold pressure −7 kPa')).toBeTruthy();
    expect(screen.queryByText(/Quick change/)).toBeNull();
    // Any other name is shown whole, even one that says "quick change" later on.
    cleanup();
    render(<CurrentSetup setup={{ ...setup, label: 'Spring baseline after the Quick change: tidy' }} day="2026-09-20" />);
    expect(screen.getByText('Spring baseline after the Quick change: tidy')).toBeTruthy();
  });
});
