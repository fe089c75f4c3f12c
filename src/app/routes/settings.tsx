import { useState } from 'react';
import { SectionCard } from '@/components/ui/section-card';
import { isApiError } from '@/lib/api-client';
import { useMe } from '@/features/auth/api/get-me';
import { useUpdatePreferences } from '@/features/auth/api/update-preferences';
import { UnitSettingsForm } from '@/features/auth/components/unit-settings-form';
import { EmailNotificationsSwitch } from '@/features/account/components/email-notifications-switch';
import { ChangePasswordForm } from '@/features/account/components/change-password-form';
import { SignedInDevices } from '@/features/account/components/signed-in-devices';
import { EmailLinkResult, SignInAddress } from '@/features/account/components/change-email';
import { CloseAccount, DownloadYourData } from '@/features/account/components/your-data';

const EMAIL_OFFLINE = 'No connection: the e-mail setting was not changed. Try again when you have signal.';

/** Notification e-mails on or off, saved as soon as the switch is pressed. */
function EmailSetting({ enabled }: { enabled: boolean }) {
  const update = useUpdatePreferences();
  const [error, setError] = useState<string | null>(null);
  return (
    <EmailNotificationsSwitch
      checked={enabled}
      isPending={update.isPending}
      error={error}
      onChange={(next) => {
        setError(null);
        update.mutate(
          { emailNotifications: next },
          { onError: (e) => setError(isApiError(e) && e.code === 'network' ? EMAIL_OFFLINE : e.message || EMAIL_OFFLINE) },
        );
      }}
    />
  );
}

export function SettingsPage() {
  const { data: user } = useMe();
  if (!user) return null;
  return (
    <div className="flex max-w-2xl flex-col gap-6">
      <title>Settings · Scrubline</title>
      <div className="flex flex-col gap-1">
        <h1 className="text-3xl font-extrabold">Settings</h1>
        <p className="text-ink-muted">Your account’s units, e-mail address and e-mails, password and signed-in devices, your data and closing the account.</p>
      </div>
      {/* The link from a new address lands here: what it did is said first, above the fold. */}
      <EmailLinkResult />
      <SectionCard title="Units">
        <p className="text-sm text-ink-muted">Units apply to every value you read and type, on every device you sign in on.</p>
        <UnitSettingsForm user={user} />
      </SectionCard>
      <SectionCard title="E-mail">
        <SignInAddress email={user.email} />
        <EmailSetting enabled={user.preferences.emailNotifications} />
      </SectionCard>
      <SectionCard title="Password">
        <ChangePasswordForm email={user.email} />
      </SectionCard>
      <SectionCard title="Signed-in devices">
        <SignedInDevices />
      </SectionCard>
      <SectionCard title="Your account’s data">
        <DownloadYourData />
      </SectionCard>
      <SectionCard title="Close account">
        <CloseAccount email={user.email} />
      </SectionCard>
    </div>
  );
}
