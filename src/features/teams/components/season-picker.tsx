import { ChevronLeft, ChevronRight } from 'lucide-react';
import { Button } from '@/components/ui/button';

/** Steps a season back or forward: two big buttons around the year, no typing. */
export function SeasonPicker({ season, onChange, label = 'Season' }: { season: number; onChange: (season: number) => void; label?: string }) {
  return (
    <div role="group" aria-label={label} className="flex items-center gap-2">
      <Button variant="secondary" className="px-3" onClick={() => onChange(season - 1)} disabled={season <= 1950}>
        <ChevronLeft aria-hidden="true" className="size-5" />
        <span className="sr-only">Season </span>
        {season - 1}
      </Button>
      <output aria-live="polite" className="tabular-figures min-w-16 text-center text-2xl font-extrabold">
        <span className="sr-only">{label}: </span>
        {season}
      </output>
      <Button variant="secondary" className="px-3" onClick={() => onChange(season + 1)} disabled={season >= 2200}>
        <span className="sr-only">Season </span>
        {season + 1}
        <ChevronRight aria-hidden="true" className="size-5" />
      </Button>
    </div>
  );
}
