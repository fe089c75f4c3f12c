import { Link } from 'react-router-dom';
import type { Suggestion } from '@shared/collab/suggestion.schema';
import { pathTo } from '@/config/paths';
import { formatDateTime } from '@/lib/dates';
import { useUnits } from '@/lib/units-context';
import { describeChange } from '../utils/suggestion-words';
import { ChangePreview } from './change-preview';
import { StatusBadge } from './suggestion-list';

/** The car page, scrolled to one snapshot (its setup timeline gives each snapshot the id `setup-<id>`). */
export const setupOnCarPage = (carId: string, setupId: string) => `${pathTo.car(carId)}#setup-${setupId}`;

/** Where the suggestion stands: waiting, or who decided what and when. */
export function DecisionStatus({ suggestion, hideSetupLink = false }: { suggestion: Suggestion; hideSetupLink?: boolean }) {
  const { status, decidedBy, decidedAt, decisionNote, acceptedSetupId, carId } = suggestion;
  return (
    <div className="flex flex-col gap-2" aria-live="polite">
      <StatusBadge status={status} />
      {status === 'open' ? (
        <p className="text-ink-muted">The car’s drivers have not decided yet.</p>
      ) : (
        <p>
          {status === 'accepted' ? 'Accepted' : status === 'declined' ? 'Declined' : 'Withdrawn'}
          {decidedBy ? ` by ${decidedBy.displayName}` : ''}
          {decidedAt ? ` on ${formatDateTime(decidedAt)}` : ''}.
        </p>
      )}
      {decisionNote ? (
        <blockquote className="border-l-4 border-line-strong pl-3">
          <p className="text-sm font-semibold text-ink-muted">The driver’s note</p>
          <p className="whitespace-pre-wrap">{decisionNote}</p>
        </blockquote>
      ) : null}
      {status === 'accepted' && acceptedSetupId && !hideSetupLink ? (
        <Link to={setupOnCarPage(carId, acceptedSetupId)} className="inline-flex min-h-tap items-center self-start font-semibold text-link underline">
          Open the new setup on the car’s page
        </Link>
      ) : null}
    </div>
  );
}

/** What the shop proposes and why, with each corner's from → to against the base snapshot. */
export function SuggestionDetails({ suggestion }: { suggestion: Suggestion }) {
  const units = useUnits();
  return (
    <div className="flex flex-col gap-4">
      <p className="text-ink-muted">
        From <span className="font-semibold text-ink">{suggestion.shop.name}</span> · {suggestion.author.displayName} ·{' '}
        {formatDateTime(suggestion.createdAt)}
      </p>
      <p className="text-sm text-ink-muted">
        Changes to <span className="font-semibold text-ink">{suggestion.baseSetup.label}</span> (in force from{' '}
        {formatDateTime(suggestion.baseSetup.effectiveFrom)}).
      </p>
      <section aria-labelledby="why" className="flex flex-col gap-1">
        <h2 id="why" className="text-xl font-bold">
          Why
        </h2>
        <p className="break-words whitespace-pre-wrap">{suggestion.rationale}</p>
      </section>
      <section aria-labelledby="changes" className="flex flex-col gap-3">
        <h2 id="changes" className="text-xl font-bold">
          Changes
        </h2>
        <ul className="tabular-figures flex list-disc flex-col gap-1 pl-5">
          {suggestion.changes.map((change, i) => (
            <li key={i}>{describeChange(change, units)}</li>
          ))}
        </ul>
        <ChangePreview cells={suggestion.preview} />
      </section>
    </div>
  );
}
