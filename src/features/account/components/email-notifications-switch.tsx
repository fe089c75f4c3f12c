import { useId } from 'react';
import { cn } from '@/lib/cn';
import { FormAlert } from '@/components/ui/form-alert';

/** The switch's label; the unsubscribe page quotes it word for word. */
const EMAIL_SETTING_LABEL = 'E-mail me about comments and suggestions';

interface EmailNotificationsSwitchProps {
  /** What is saved now. */
  checked: boolean;
  /** Saves the new value; the switch shows it as soon as it is saved. */
  onChange: (next: boolean) => void;
  isPending: boolean;
  error: string | null;
}

/** On or off for notification e-mails: one big switch, its state in words as well as in its position. */
export function EmailNotificationsSwitch({ checked, onChange, isPending, error }: EmailNotificationsSwitchProps) {
  const hintId = useId();
  return (
    <div className="flex flex-col gap-2">
      <button
        type="button"
        role="switch"
        aria-checked={checked}
        aria-describedby={hintId}
        aria-busy={isPending || undefined}
        disabled={isPending}
        onClick={() => onChange(!checked)}
        className="flex min-h-tap w-full items-center justify-between gap-4 rounded border border-line-strong bg-surface px-3 py-2 text-left disabled:opacity-60"
      >
        <span className="font-semibold">{EMAIL_SETTING_LABEL}</span>
        <span className="flex shrink-0 items-center gap-2">
          <span className="text-sm font-bold text-ink-muted">{isPending ? 'Saving…' : checked ? 'On' : 'Off'}</span>
          <span
            aria-hidden="true"
            className={cn('flex h-7 w-12 items-center rounded-full border-2 p-0.5', checked ? 'justify-end border-accent bg-accent' : 'justify-start border-line-strong bg-surface-raised')}
          >
            <span className={cn('size-5 rounded-full', checked ? 'bg-accent-ink' : 'bg-line-strong')} />
          </span>
        </span>
      </button>
      <p id={hintId} className="text-sm text-ink-muted">
        When someone comments on your cars or a shop suggests a setup. You see these in the app either way; every e-mail also has a link to
        stop them.
      </p>
      <FormAlert message={error} />
    </div>
  );
}
