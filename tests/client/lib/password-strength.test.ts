import { describe, expect, it } from 'vitest';
import { loadStrengthEstimator } from '@/lib/password-strength';

/*
 * The estimator is zxcvbn-ts (Wheeler, "zxcvbn: Low-Budget Password Strength Estimation", USENIX Security 2016);
 * these check that it is wired with its common-password list, keyboard graphs and English feedback, and with
 * the account's own words. Its scores are its own: 0 for a password among the most used, 4 for one that would
 * take over 10^10 guesses (the zxcvbn paper's scale).
 */
describe('the password strength estimate', () => {
  it('when the password is among the most used, then it is very weak and the advice says so', async () => {
    const estimate = await loadStrengthEstimator();
    expect(estimate('password', [])).toMatchObject({ score: 0, label: 'Very weak', warning: 'This is a heavily used password.' });
  });

  it('when the password is a run of keys, a repeat or a sequence, then the advice names the pattern', async () => {
    const estimate = await loadStrengthEstimator();
    expect(estimate('aaaaaaaaaaaa', []).warning).toBe('Repeated characters like "aaa" are easy to guess.');
    expect(estimate('abcdefghijkl', []).warning).toBe('Common character sequences like "abc" are easy to guess.');
  });

  it('when the password is four unrelated words, then it is very strong with nothing to add', async () => {
    const estimate = await loadStrengthEstimator();
    expect(estimate('copper kettle under the grandstand', [])).toMatchObject({ score: 4, label: 'Very strong', warning: null });
  });

  it('when the password is made of the account\'s name, then it scores lower than the same letters for someone else', async () => {
    const estimate = await loadStrengthEstimator();
    const stranger = estimate('marenholloway', []);
    const own = estimate('marenholloway', ['maren.holloway@example.com', 'Maren Holloway']);
    expect(own.score).toBeLessThan(stranger.score);
    expect(own.warning).toBe('There should not be any personal or page related data.');
  });

  it('when loaded twice, then the word lists are loaded once and the same estimator is shared', async () => {
    expect(await loadStrengthEstimator()).toBe(await loadStrengthEstimator());
  });
});
