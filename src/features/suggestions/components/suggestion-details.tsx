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

/** Where the suggestion stands: waiting (for the reader, when `mine`: a driver of the car), or who decided what and when. */
export function DecisionStatus({ suggestion, hideSetupLink = false, mine = false }: { suggestion: Suggestion; hideSetupLink?: boolean; mine?: boolean }) {
  const { status, decidedBy, decidedAt, decisionNote, acceptedSetupId, carId } = suggestion;
  return (
    <div className="flex flex-col gap-2" aria-live="polite">
      <StatusBadge status={status} />
      {status === 'open' ? (
        <p className="text-ink-muted">{mine ? 'Waiting for your answer: accept it or decline it below.' : 'The car’s drivers have not decided yet.'}</p>
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

/** "“Sep 20 setup” (in force from Sep 20, 2026, 09:00)". */
function SetupName({ setup }: { setup: Suggestion['baseSetup'] }) {
  return (
    <>
      “<span className="font-semibold text-ink">{setup.label}</span>” (in force from {formatDateTime(setup.effectiveFrom)})
    </>
  );
}

/** The changes as the shop wrote them, on the setup it wrote them for, below what applies to the car today. */
function AsSuggested({ base, cells }: { base: Suggestion['baseSetup']; cells: Suggestion['preview'] }) {
  return (
    <section aria-label="What the shop suggested" className="flex flex-col gap-2">
      <p className="text-sm text-ink-muted">
        As the shop suggested it, on <SetupName setup={base} />:
      </p>
      <ChangePreview cells={cells} />
    </section>
  );
}

/**
 * What the changes do to each corner. While open, when the car's setup has moved on since the shop wrote them, what
 * accepting now would record comes first, beside what was suggested; once accepted, what was recorded.
 */
function ChangedValues({ suggestion }: { suggestion: Suggestion }) {
  const { now, recorded, baseSetup, preview } = suggestion;
  if (recorded) {
    const sameStart = recorded.from.id === baseSetup.id;
    return (
      <div className="flex flex-col gap-3">
        <section aria-label="What accepting recorded" className="flex flex-col gap-2">
          <p className="text-sm">
            {/* The setup's values as it holds them today: it may have been edited since it was accepted. */}
            Accepted into “<span className="font-semibold">{recorded.setup.label}</span>”, in force from{' '}
            {formatDateTime(recorded.setup.effectiveFrom)}
            {sameStart ? '' : <>, made from <SetupName setup={recorded.from} /></>}. What it holds now:
          </p>
          <ChangePreview cells={recorded.preview} />
        </section>
        {sameStart ? null : <AsSuggested base={baseSetup} cells={preview} />}
      </div>
    );
  }
  if (now) {
    return (
      <div className="flex flex-col gap-3">
        <section aria-label="What accepting would record now" className="flex flex-col gap-2 rounded border-2 border-warning p-3">
          {/* Not "has changed since": the shop may have written it for an older setup, or one still to come. */}
          <p className="font-semibold">The car runs on another setup now than the one the shop wrote this for.</p>
          <p className="text-sm">
            The shop wrote these changes for <SetupName setup={baseSetup} />. The car now runs <SetupName setup={now.setup} />.{' '}
            {now.problems.length ? 'That setup cannot take them as they are, so accepting now would be refused:' : 'Accepting now applies the changes to that setup and records:'}
          </p>
          {now.problems.length ? (
            <ul className="list-disc pl-5 text-sm font-semibold text-warning">
              {now.problems.map((problem) => (
                <li key={problem}>{problem}</li>
              ))}
            </ul>
          ) : (
            <ChangePreview cells={now.preview} />
          )}
        </section>
        <AsSuggested base={baseSetup} cells={preview} />
      </div>
    );
  }
  return <ChangePreview cells={preview} />;
}

/** What the shop proposes and why, with each corner's from → to against the setup it applies to. */
export function SuggestionDetails({ suggestion }: { suggestion: Suggestion }) {
  const units = useUnits();
  return (
    <div className="flex flex-col gap-4">
      <p className="text-ink-muted">
        From <span className="font-semibold text-ink">{suggestion.shop.name}</span> · {suggestion.author.displayName} ·{' '}
        {formatDateTime(suggestion.createdAt)}
      </p>
      <p className="text-sm text-ink-muted">
        Suggested for the setup <SetupName setup={suggestion.baseSetup} />.
      </p>
      <section aria-labelledby="why" className="flex flex-col gap-1">
        <h2 id="why" className="text-xl font-bold">
          Why
        </h2>
        <p className="wrap-anywhere whitespace-pre-wrap">{suggestion.rationale}</p>
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
        <ChangedValues suggestion={suggestion} />
      </section>
    </div>
  );
}
