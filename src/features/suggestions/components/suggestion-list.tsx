import { Link } from 'react-router-dom';
import { ChevronRight } from 'lucide-react';
import type { Suggestion, SuggestionStatus } from '@shared/collab/suggestion.schema';
import { recordPath } from '@/config/record-paths';
import { cn } from '@/lib/cn';
import { formatDay } from '@/lib/dates';
import { SectionCard } from '@/components/ui/section-card';
import { useSuggestions } from '../api/get-suggestions';

const STATUS_WORDS: Record<SuggestionStatus, string> = {
  open: 'Waiting for the driver',
  accepted: 'Accepted',
  declined: 'Declined',
  withdrawn: 'Withdrawn',
};

/**
 * A suggestion's state. `forDriver`: read by the car's drivers, whose answer it waits for, so an open one says so
 * to them rather than naming them in the third person.
 */
export function StatusBadge({ status, forDriver = false }: { status: Suggestion['status']; forDriver?: boolean }) {
  return (
    <span
      className={cn(
        'inline-flex items-center self-start rounded px-2 text-sm font-bold',
        status === 'open' ? 'bg-accent text-accent-ink' : status === 'accepted' ? 'bg-success-surface text-success' : 'bg-surface-raised text-ink-muted',
      )}
    >
      {status === 'open' && forDriver ? 'Waiting for you: accept or decline' : STATUS_WORDS[status]}
    </span>
  );
}

/** Suggestions as links to their pages, each with its shop, author, day and state. */
function SuggestionLinks({ items, label, forDriver }: { items: readonly Suggestion[]; label: string; forDriver: boolean }) {
  return (
    <ul className="flex flex-col gap-2" aria-label={label}>
      {items.map((s) => (
        <li key={s.id}>
          <Link to={recordPath.suggestion(s.id)} className="flex min-h-tap items-center gap-3 rounded border border-line p-3 hover:bg-surface-raised">
            <span className="flex min-w-0 flex-1 flex-col gap-0.5">
              <span className="font-bold wrap-anywhere">{s.title}</span>
              <span className="text-sm text-ink-muted">
                {s.shop.name} · {s.author.displayName} · {formatDay(s.createdAt)}
              </span>
              <StatusBadge status={s.status} forDriver={forDriver} />
            </span>
            <ChevronRight aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
          </Link>
        </li>
      ))}
    </ul>
  );
}

/** A car's suggestions from its shops, newest first; each opens its own page. */
export function SuggestionList({ carId, emptyText, forDriver = false }: { carId: string; emptyText: string; forDriver?: boolean }) {
  const { data, isPending, isError } = useSuggestions(carId);
  if (isPending) return <p className="text-ink-muted">Loading suggestions…</p>;
  if (isError) return <p className="text-ink-muted">Suggestions could not be loaded. Try again shortly.</p>;
  if (data.items.length === 0) return <p className="text-sm text-ink-muted">{emptyText}</p>;
  return <SuggestionLinks items={data.items} label="Suggestions" forDriver={forDriver} />;
}

/**
 * For the car's drivers, near the top of its page: the suggestions still waiting for their answer, oldest first.
 * Nothing while none is open (the full list further down says the rest).
 */
export function OpenSuggestions({ carId }: { carId: string }) {
  const { data } = useSuggestions(carId);
  const open = (data?.items ?? []).filter((s) => s.status === 'open').reverse();
  if (open.length === 0) return null;
  return (
    <SectionCard title={`Waiting for you: ${open.length} setup suggestion${open.length === 1 ? '' : 's'}`}>
      <SuggestionLinks items={open} label="Suggestions waiting for you" forDriver />
    </SectionCard>
  );
}
