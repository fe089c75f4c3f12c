import { Link } from 'react-router-dom';
import { ChevronRight, Lightbulb } from 'lucide-react';
import { recordPath } from '@/config/record-paths';
import { SectionCard } from '@/components/ui/section-card';
import { useWaitingSuggestions } from '../api/get-waiting-suggestions';

/**
 * Home's "Waiting for you": one line per open suggestion from a shop on a car the user drives, each opening it to
 * accept or decline. Nothing at all while there is none (or it cannot be loaded: each car's page lists them too).
 */
export function WaitingSuggestions() {
  const { data } = useWaitingSuggestions();
  if (!data || data.items.length === 0) return null;
  const title = `Waiting for you: ${data.count} setup suggestion${data.count === 1 ? '' : 's'}`;
  return (
    <SectionCard title={title}>
      <ul className="flex flex-col gap-2" aria-label="Suggestions waiting for you">
        {data.items.map((s) => (
          <li key={s.id}>
            <Link to={recordPath.suggestion(s.id)} className="flex min-h-tap items-center gap-3 rounded border border-line p-3 hover:bg-surface-raised">
              <Lightbulb aria-hidden="true" className="size-5 shrink-0 text-accent" />
              <span className="flex min-w-0 flex-1 flex-col">
                <span className="font-bold wrap-anywhere">{s.title}</span>
                <span className="text-sm text-ink-muted">
                  {s.car.name} · from {s.shop.name} · accept or decline
                </span>
              </span>
              <ChevronRight aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
            </Link>
          </li>
        ))}
      </ul>
    </SectionCard>
  );
}
