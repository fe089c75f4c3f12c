import { SectionCard } from '@/components/ui/section-card';
import { SectionBoundary } from '@/components/errors/section-boundary';
import { useMe } from '@/features/auth/api/get-me';
import { describeRoles } from '@/features/auth/utils/describe-roles';
import { SyncStatus } from '@/features/sync/components/sync-status';
import { CarList } from '@/features/cars/components/car-list';
import { CurrentEventCard } from '@/features/events/components/current-event-card';

export function HomePage() {
  const { data: user } = useMe();
  if (!user) return null;
  const roles = describeRoles(user.roles);

  return (
    <div className="flex flex-col gap-6">
      <title>Home · Scrubline</title>
      <div className="flex flex-col gap-1">
        <h1 className="text-3xl font-extrabold">Hi, {user.displayName}</h1>
        <p className="text-ink-muted">{roles ? `Your roles: ${roles}.` : 'Your account has no roles yet.'}</p>
      </div>
      <div className="grid gap-4 md:grid-cols-2">
        <SectionBoundary title="Event day">
          <SectionCard title="Event day">
            <CurrentEventCard />
          </SectionCard>
        </SectionBoundary>
        <SectionBoundary title="Sync">
          <SectionCard title="Sync">
            <SyncStatus />
          </SectionCard>
        </SectionBoundary>
        <SectionBoundary title="Your cars">
          <SectionCard title="Your cars">
            <CarList currentUserId={user.id} />
          </SectionCard>
        </SectionBoundary>
      </div>
    </div>
  );
}
