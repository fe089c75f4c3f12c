import { cn } from '@/lib/cn';

/** The name, set in our type; the accent bar under "Scrub" is the only decoration. */
export function Wordmark({ className }: { className?: string }) {
  return (
    <span className={cn('text-xl font-extrabold tracking-tight text-ink', className)}>
      <span className="border-b-4 border-accent">Scrub</span>line
    </span>
  );
}
