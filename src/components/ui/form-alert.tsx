import { TriangleAlert } from 'lucide-react';

/** A message about the whole form (wrong password, too many attempts, no connection), read out at once. */
export function FormAlert({ message }: { message: string | null | undefined }) {
  return (
    <div role="alert" aria-live="assertive">
      {message ? (
        <p className="flex items-start gap-2 rounded border border-warning-line bg-warning-surface p-3 font-semibold text-warning">
          <TriangleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
          <span>{message}</span>
        </p>
      ) : null}
    </div>
  );
}
