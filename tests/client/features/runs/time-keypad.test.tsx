// @vitest-environment jsdom
import { useState } from 'react';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it } from 'vitest';
import { parseRunTime } from '../../../../shared/season/run-time';
import { TimeKeypad } from '@/features/runs/components/time-keypad';

afterEach(cleanup);

/** The keypad as the run form uses it: the text is kept outside, a paste is read at once. */
function Harness() {
  const [text, setText] = useState('');
  const [error, setError] = useState<string | null>(null);
  return (
    <TimeKeypad
      value={text}
      onChange={(t) => {
        setText(t);
        setError(null);
      }}
      onPaste={(t) => {
        setText(t);
        const parsed = parseRunTime(t);
        setError(parsed.ok ? null : parsed.error);
      }}
      error={error}
    />
  );
}

const display = () => screen.getByLabelText(/Raw time/) as HTMLInputElement;

async function tap(user: ReturnType<typeof userEvent.setup>, keys: string[]) {
  const names: Record<string, string> = { ':': 'Colon', '.': 'Point', '⌫': 'Backspace' };
  for (const k of keys) await user.click(screen.getByRole('button', { name: names[k] ?? k }));
}

describe('time keypad', () => {
  it('when 1:05.432 is tapped on the keypad, then the display holds exactly that', async () => {
    const user = userEvent.setup();
    render(<Harness />);

    await tap(user, ['1', ':', '0', '5', '.', '4', '3', '2']);

    expect(display().value).toBe('1:05.432');
    expect(parseRunTime(display().value)).toEqual({ ok: true, seconds: 65.432 });
  });

  it('when backspace is tapped, then the last character goes and the rest stays', async () => {
    const user = userEvent.setup();
    render(<Harness />);

    await tap(user, ['4', '5', '.', '6', '7', '9', '⌫', '8']);

    expect(display().value).toBe('45.678');
  });

  it('when a time from a timing sheet is pasted, then it is taken as pasted, without an error', async () => {
    const user = userEvent.setup();
    render(<Harness />);

    await user.click(display());
    await user.paste('  1:05.432 ');

    expect(display().value).toBe('1:05.432');
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('when a time that cannot be read is pasted, then the parser’s message is shown beside it', async () => {
    const user = userEvent.setup();
    render(<Harness />);

    await user.click(display());
    await user.paste('1:5.4');

    const alert = screen.getByRole('alert');
    expect(alert.textContent).toBe('After the minutes, give the seconds as two digits, e.g. 1:05.432');
    expect(display().getAttribute('aria-invalid')).toBe('true');
    expect(display().value).toBe('1:5.4');
  });

  it('when letters are typed on a keyboard, then only what a time can hold is kept', async () => {
    const user = userEvent.setup();
    render(<Harness />);

    await user.type(display(), '4x5.6s78');

    expect(display().value).toBe('45.678');
  });

  it('when the keys are drawn, then each is a button of its own with a name (gloves, screen readers)', () => {
    render(<Harness />);
    for (const name of ['0', '1', '2', '3', '4', '5', '6', '7', '8', '9', 'Colon', 'Point', 'Backspace', 'Clear']) {
      expect(screen.getByRole('button', { name })).toBeTruthy();
    }
  });
});
