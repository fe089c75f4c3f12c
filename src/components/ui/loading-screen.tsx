/** Shown while the app finds out who is signed in; calm text, no spinner animation. */
export function LoadingScreen({ label = 'Loading Scrubline…' }: { label?: string }) {
  return (
    <div className="flex min-h-dvh items-center justify-center px-4" role="status">
      <p className="text-lg font-semibold text-ink-muted">{label}</p>
    </div>
  );
}
