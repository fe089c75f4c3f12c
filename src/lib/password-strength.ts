import type { ZxcvbnResult } from '@zxcvbn-ts/core';

/*
 * How hard a new password would be to guess, by zxcvbn-ts (the estimator of Wheeler, "zxcvbn: Low-Budget
 * Password Strength Estimation", USENIX Security 2016): common passwords, names, words, dates, keyboard
 * patterns and repeats, scored 0 to 4 by the guesses they would take. Its word lists are large, so they are
 * loaded only when someone starts typing a new password, and kept apart from the app's other files.
 */

export type Strength = { score: ZxcvbnResult['score']; label: string; warning: string | null; suggestions: string[] };

/** The estimator's five scores, as the meter says them. */
export const STRENGTH_LABELS = ['Very weak', 'Weak', 'Fair', 'Strong', 'Very strong'] as const;

type Estimator = (password: string, userInputs: string[]) => Strength;
let loading: Promise<Estimator> | null = null;

/** Loads the estimator and its word lists once; later calls share it. */
export function loadStrengthEstimator(): Promise<Estimator> {
  loading ??= Promise.all([import('@zxcvbn-ts/core'), import('@zxcvbn-ts/language-common'), import('@zxcvbn-ts/language-en/dist/translations')])
    .then(([core, common, { default: translations }]) => {
      // The common passwords and diceware words, and the English feedback; not the English word lists
      // (names, Wikipedia), which would triple what a phone downloads for a meter that only advises.
      const zxcvbn = new core.ZxcvbnFactory({
        dictionary: common.dictionary,
        graphs: common.adjacencyGraphs,
        translations,
      });
      return (password: string, userInputs: string[]) => {
        // The account's own words, one by one: "maren.holloway@example.com" is "maren", "holloway", "example", "com".
        const words = userInputs.flatMap((input) => input.toLowerCase().split(/[^\p{L}\p{N}]+/u)).filter((w) => w.length >= 3);
        const result = zxcvbn.check(password, words);
        return {
          score: result.score,
          label: STRENGTH_LABELS[result.score],
          warning: result.feedback.warning,
          suggestions: result.feedback.suggestions,
        };
      };
    })
    .catch((err: unknown) => {
      // A failed load (no signal) is tried again at the next keystroke.
      loading = null;
      throw err;
    });
  return loading;
}
