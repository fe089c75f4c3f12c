import { useEffect, useState } from 'react';
import { loadStrengthEstimator, type Strength } from '@/lib/password-strength';
import { cn } from '@/lib/cn';

/** Bar colours by score: warning for the two weakest, the accent once it is fair or better. */
const FILLED = ['bg-warning', 'bg-warning', 'bg-accent', 'bg-accent', 'bg-accent'] as const;

/**
 * A meter under a new-password field (OWASP ASVS 4.0.3 V2.1.8): how hard the password would be to guess, and
 * what makes it weak. It advises only; the rules the server checks are the field's hint. `userInputs` are
 * words of this account (the e-mail, the name) that make a password easier to guess.
 */
export function PasswordStrength({ password, userInputs = [] }: { password: string; userInputs?: string[] }) {
  // The latest estimate; while the next one is worked out (a moment after each key) it stays in view.
  const [latest, setLatest] = useState<Strength | null>(null);
  const inputs = userInputs.join('\n');

  useEffect(() => {
    if (!password) return;
    let current = true;
    loadStrengthEstimator()
      .then((estimate) => {
        if (current) setLatest(estimate(password.slice(0, 128), inputs.split('\n').filter(Boolean)));
      })
      // No signal for the word lists: no meter; the rules still hold.
      .catch(() => undefined);
    return () => {
      current = false;
    };
  }, [password, inputs]);

  const strength = password ? latest : null;
  if (!strength) return null;
  const advice = strength.warning ?? strength.suggestions[0] ?? null;
  return (
    <div className="flex flex-col gap-1" aria-live="polite">
      <div className="flex gap-1" aria-hidden="true">
        {[0, 1, 2, 3].map((i) => (
          <span key={i} className={cn('h-1.5 flex-1 rounded', i < Math.max(1, strength.score) ? FILLED[strength.score] : 'bg-line')} />
        ))}
      </div>
      <p className="text-sm">
        <span className="font-semibold">Strength: {strength.label}.</span>
        {advice ? <span className="text-ink-muted"> {advice}</span> : null}
      </p>
    </div>
  );
}
