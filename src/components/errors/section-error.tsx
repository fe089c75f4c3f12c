import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';

/** The fallback for one part of a page: says what failed, offers to try again, leaves the rest alone. */
export function SectionError({ title, error, onRetry }: { title: string; error: unknown; onRetry: () => void }) {
  const detail = isApiError(error) ? error.message : 'This part of the page could not be shown.';
  return (
    <div role="alert" className="flex flex-col gap-3 rounded-lg border border-warning-line bg-warning-surface p-4">
      <p className="font-bold text-warning">{title} did not load</p>
      <p className="text-ink">{detail}</p>
      <div>
        <Button variant="secondary" onClick={onRetry}>
          Try again
        </Button>
      </div>
    </div>
  );
}
