import { SectionCard } from '@/components/ui/section-card';
import { useMe } from '@/features/auth/api/get-me';
import { UnitSettingsForm } from '@/features/auth/components/unit-settings-form';

export function SettingsPage() {
  const { data: user } = useMe();
  if (!user) return null;
  return (
    <div className="flex max-w-2xl flex-col gap-6">
      <title>Settings · Scrubline</title>
      <div className="flex flex-col gap-1">
        <h1 className="text-3xl font-extrabold">Settings</h1>
        <p className="text-ink-muted">Units apply to every value you read and type, on every device you sign in on.</p>
      </div>
      <SectionCard title="Units">
        <UnitSettingsForm user={user} />
      </SectionCard>
    </div>
  );
}
