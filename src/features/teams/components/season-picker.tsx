import { ChevronLeft, ChevronRight } from 'lucide-react';
import { Button } from '@/components/ui/button';

/** Steps a season back or forward: two big buttons around the year, no typing. */
export function SeasonPicker({ season, onChange, label = 'Season' }: { season: number; onChange: (season: number) => void; label?: string }) {
  return (
    // The two buttons share what width there is, so the three fit a 320 px screen inside a card.
    <div role="group" aria-label={label} className="flex max-w-sm items-center gap-2">
      <Button variant="secondary" className="min-w-0 flex-1 gap-1 px-2" onClick={() => onChange(season - 1)} disabled={season <= 1950}>
        <ChevronLeft aria-hidden="true" className="size-5 shrink-0" />
        <span className="sr-only">Season </span>
        {season - 1}
      </Button>
      <output aria-live="polite" className="tabular-figures min-w-16 shrink-0 text-center text-2xl font-extrabold">
        <span className="sr-only">{label}: </span>
        {season}
      </output>
      <Button variant="secondary" className="min-w-0 flex-1 gap-1 px-2" onClick={() => onChange(season + 1)} disabled={season >= 2200}>
        <span className="sr-only">Season </span>
        {season + 1}
        <ChevronRight aria-hidden="true" className="size-5 shrink-0" />
      </Button>
    </div>
  );
}
