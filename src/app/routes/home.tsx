import { lazy, Suspense, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ChevronRight } from 'lucide-react';
import { paths } from '@/config/paths';
import { SectionCard } from '@/components/ui/section-card';
import { SectionBoundary } from '@/components/errors/section-boundary';
import { useMe } from '@/features/auth/api/get-me';
import { describeRoles } from '@/features/auth/utils/describe-roles';
import { SyncStatus } from '@/features/sync/components/sync-status';
import { CarList } from '@/features/cars/components/car-list';
import { CurrentEventCard } from '@/features/events/components/current-event-card';
import { useEventViews } from '@/features/events/hooks/use-event-views';
import { useMyTeams } from '@/features/teams/api/get-my-teams';
import { useCars } from '@/features/cars/api/get-cars';
import { recordPath } from '@/config/record-paths';
import { CardSection } from '@/components/layouts/card-section';

function HomeLink({ to, title, children }: { to: string; title: string; children: ReactNode }) {
  return (
    <Link to={to} className="flex min-h-tap items-center gap-3 rounded border border-line p-3 hover:bg-surface-raised">
      <span className="flex min-w-0 flex-1 flex-col">
        <span className="font-bold">{title}</span>
        <span className="text-sm text-ink-muted">{children}</span>
      </span>
      <ChevronRight aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
    </Link>
  );
}

// Suggestions waiting for the driver's answer: loaded only for someone with a car, so Home stays as light for the rest.
const WaitingSuggestions = lazy(async () => ({ default: (await import('@/features/suggestions/components/waiting-suggestions')).WaitingSuggestions }));

export function HomePage() {
  const { data: user } = useMe();
  // Each team's class board one tap from here; offline or not yet answered, the Teams link still leads to them.
  const { data: teams } = useMyTeams();
  // The same list "Your cars" shows (one request for both).
  const { data: cars } = useCars();
  const { events, isPending: eventsPending } = useEventViews();
  if (!user) return null;
  const drivesACar = (cars?.items.length ?? 0) > 0;
  const roles = describeRoles(user.roles);
  const staff = user.roles.includes('shop_staff');
  const admin = user.roles.includes('admin');
  const captain = user.roles.includes('team_captain');
  // "Teams", "Shop and teams", "Teams and accounts", "Shop, teams, and accounts".
  const links = new Intl.ListFormat('en', { type: 'conjunction' }).format([...(staff ? ['shop'] : []), 'teams', ...(admin ? ['accounts'] : [])]);
  const linksTitle = links[0]!.toUpperCase() + links.slice(1);

  const linksCard = (
    <SectionCard title={linksTitle}>
      <nav aria-label={linksTitle} className="flex flex-col gap-2">
        {staff ? (
          <HomeLink to={paths.shop} title="Your shop">
            Customers’ cars, suggestions and staff
          </HomeLink>
        ) : null}
        {teams?.items.map((team) => (
          <HomeLink key={team.id} to={recordPath.classBoard(team.id)} title={`${team.name}: class board`}>
            Each team car’s best times against its class
          </HomeLink>
        ))}
        <HomeLink to={paths.teams} title="Teams">
          Your teams and their class boards
        </HomeLink>
        {admin ? (
          <HomeLink to={paths.accounts} title="Accounts">
            Find an account; suspend or restore its sign-in
          </HomeLink>
        ) : null}
      </nav>
    </SectionCard>
  );
  // A captain, the shop's staff or an admin come here for the board, the customers or the accounts more than
  // for a car of their own, so their links come first, above today's event.
  const linksFirst = captain || staff || admin;
  // Someone here for those links, with no car and no event to go to, is not offered to start an event day.
  const eventDay = !(linksFirst && cars && !drivesACar && !eventsPending && events.length === 0);

  return (
    <div className="flex flex-col gap-6">
      <title>Home · Scrubline</title>
      <div className="flex flex-col gap-1">
        <h1 className="text-3xl font-extrabold">Hi, {user.displayName}</h1>
        <p className="text-ink-muted">{roles ? `Your roles: ${roles}.` : 'Your account has no roles yet.'}</p>
      </div>
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        {linksFirst ? linksCard : null}
        {eventDay ? (
          <CardSection title="Event day">
            <CurrentEventCard />
          </CardSection>
        ) : null}
        {/* After the event: at the track, logging comes first; an answer to the shop can wait a heat. */}
        {drivesACar ? (
          <SectionBoundary title="Waiting for you">
            <Suspense fallback={null}>
              <WaitingSuggestions />
            </Suspense>
          </SectionBoundary>
        ) : null}
        <CardSection title="Sync">
          <SyncStatus />
        </CardSection>
        <CardSection title="Your cars">
          <CarList currentUserId={user.id} />
        </CardSection>
        {linksFirst ? null : linksCard}
      </div>
    </div>
  );
}
