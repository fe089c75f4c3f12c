import { Table2 } from 'lucide-react';
import { Button } from '@/components/ui/button';

/** The button under a chart that shows the same numbers as a table (for screen readers, and for reading exact values). */
export function ShowTableToggle({ shown, onToggle, controls }: { shown: boolean; onToggle: () => void; controls: string }) {
  return (
    <Button variant="secondary" className="self-start" aria-expanded={shown} aria-controls={controls} onClick={onToggle}>
      <Table2 aria-hidden="true" className="size-5" />
      {shown ? 'Hide table' : 'Show as table'}
    </Button>
  );
}

/** Stands in for a table while its code arrives. */
export function TableLoading() {
  return <p className="text-sm text-ink-muted">Loading the table…</p>;
}
