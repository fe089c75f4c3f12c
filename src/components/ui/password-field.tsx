import { useState, type ComponentProps } from 'react';
import { Eye, EyeOff } from 'lucide-react';
import { TextField } from './text-field';

type PasswordFieldProps = Omit<ComponentProps<typeof TextField>, 'type' | 'trailing'>;

/** A password input with a Show/Hide switch: easier than retyping with cold hands. */
export function PasswordField(props: PasswordFieldProps) {
  const [visible, setVisible] = useState(false);
  const Icon = visible ? EyeOff : Eye;
  return (
    <TextField
      {...props}
      type={visible ? 'text' : 'password'}
      autoCapitalize="none"
      autoCorrect="off"
      spellCheck={false}
      trailing={
        <button
          type="button"
          className="inline-flex min-h-tap min-w-tap shrink-0 items-center justify-center gap-1 rounded border border-line-strong bg-surface px-3 text-sm font-semibold text-ink hover:bg-surface-raised"
          onClick={() => setVisible((v) => !v)}
        >
          <Icon aria-hidden="true" className="size-4" />
          {visible ? 'Hide' : 'Show'}
          <span className="sr-only"> password</span>
        </button>
      }
    />
  );
}
