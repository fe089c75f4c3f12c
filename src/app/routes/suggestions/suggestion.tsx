import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { pathTo } from '@/config/paths';
import { recordPath } from '@/config/record-paths';
import { Caution } from '@/components/ui/caution';
import { PageMessage } from '@/components/ui/page-message';
import { SectionCard } from '@/components/ui/section-card';
import { isApiError } from '@/lib/api-client';
import { useMe } from '@/features/auth/api/get-me';
import { carQueryOptions } from '@/features/cars/api/get-car';
import { setupKeys } from '@/features/setups/api/setup-keys';
import { useSuggestion } from '@/features/suggestions/api/get-suggestion';
import { DecisionPanel } from '@/features/suggestions/components/decision-panel';
import { UnusualValues, valuesBefore } from '@/features/suggestions/components/unusual-values';
import { DecisionStatus, SuggestionDetails } from '@/features/suggestions/components/suggestion-details';
import { refreshAfterWrite } from '@/lib/refresh-after-write';
import { BackLink } from '@/components/ui/back-link';

/** One suggestion: what and why; the car's drivers accept or decline it while it is open. */
export function SuggestionPage() {
  const { suggestionId = '' } = useParams();
  const queryClient = useQueryClient();
  const { data: me } = useMe();
  const { data: suggestion, isPending, isError, error } = useSuggestion(suggestionId);
  const car = useQuery({ ...carQueryOptions(suggestion?.carId ?? ''), enabled: Boolean(suggestion) });
  const [acceptedHere, setAcceptedHere] = useState(false);

  if (isPending) return <p className="text-ink-muted">Loading the suggestion…</p>;
  if (isError) {
    return (
      <PageMessage variant="in-shell" title={isApiError(error) && error.status === 404 ? 'Suggestion not found' : 'The suggestion could not be loaded'}>
        <p>
          {isApiError(error) && error.status === 404
            ? 'It may be for a car you no longer have access to.'
            : 'Try again when you have signal.'}
        </p>
      </PageMessage>
    );
  }

  const isDriver = Boolean(me && car.data && (car.data.owner.id === me.id || car.data.coDrivers.some((p) => p.id === me.id)));
  const back = isDriver ? pathTo.car(suggestion.carId) : recordPath.shopCustomer(suggestion.carId);

  return (
    <div className="flex max-w-2xl flex-col gap-6">
      <title>{`${suggestion.title} · Scrubline`}</title>
      <div className="flex flex-col gap-2">
        <BackLink to={back}>{car.data?.name ?? 'Car'}</BackLink>
        <p className="text-sm font-semibold text-ink-muted">Setup suggestion</p>
        <h1 className="text-3xl font-extrabold wrap-anywhere">{suggestion.title}</h1>
      </div>
      <SuggestionDetails suggestion={suggestion} />
      <SectionCard title="Decision">
        <DecisionStatus suggestion={suggestion} hideSetupLink={acceptedHere} mine={isDriver} />
        {/* The shop, back on what it sent: the same caution the driver reads before deciding. */}
        {car.data && !isDriver && suggestion.status === 'open' ? (
          <UnusualValues side="sent" changes={suggestion.changes} current={valuesBefore(suggestion.preview)} />
        ) : null}
        {isDriver ? (
          <>
            {suggestion.status === 'open' ? (
              <Caution>
                <p>
                  Make alignment, suspension and pressure changes within the vehicle and tyre makers’ data and the event’s rules,
                  and have them done by someone competent to do them. Accept once the car is set up this way.
                </p>
              </Caution>
            ) : null}
            <DecisionPanel
              suggestion={suggestion}
              onAccepted={() => {
                setAcceptedHere(true);
                void refreshAfterWrite(queryClient, { queryKey: setupKeys.ofCar(suggestion.carId) });
              }}
            />
          </>
        ) : null}
      </SectionCard>
    </div>
  );
}
