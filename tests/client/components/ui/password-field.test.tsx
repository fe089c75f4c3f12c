// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it } from 'vitest';
import { PasswordField } from '@/components/ui/password-field';

afterEach(cleanup);

/** The password field (OWASP ASVS 4.0.3 V2.1.11: pasting and password managers are allowed; V2.1.12: the password can be shown). */
describe('the password field', () => {
  it('when Show is pressed, then the password is shown as text until Hide is pressed, and what was typed stays', async () => {
    render(<PasswordField label="Password" autoComplete="current-password" />);
    const u = userEvent.setup();
    const field = screen.getByLabelText('Password');
    await u.type(field, 'cold hands');
    expect(field.getAttribute('type')).toBe('password');

    await u.click(screen.getByRole('button', { name: 'Show password' }));
    expect(field.getAttribute('type')).toBe('text');
    expect((field as HTMLInputElement).value).toBe('cold hands');

    await u.click(screen.getByRole('button', { name: 'Hide password' }));
    expect(field.getAttribute('type')).toBe('password');
  });

  it('when a password is pasted, then the field takes it whole, and a password manager is told what the field is for', async () => {
    render(<PasswordField label="Password" autoComplete="new-password" />);
    const u = userEvent.setup();
    const field = screen.getByLabelText('Password');
    await u.click(field);
    await u.paste('a long phrase from a manager 🔑');
    expect((field as HTMLInputElement).value).toBe('a long phrase from a manager 🔑');
    expect(field.getAttribute('autocomplete')).toBe('new-password');
    // Nothing stands in the way of a manager filling it in or of the phone's keyboard: no auto-capitals or corrections.
    expect(field.getAttribute('autocapitalize')).toBe('none');
    expect(field.getAttribute('autocorrect')).toBe('off');
  });
});
