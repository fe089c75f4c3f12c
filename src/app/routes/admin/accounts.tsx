import { SectionBoundary } from '@/components/errors/section-boundary';
import { EmptyState } from '@/components/ui/empty-state';
import { useMe } from '@/features/auth/api/get-me';
import { AccountList } from '@/features/admin/components/account-list';

/** Admins: the accounts, and suspending or restoring one's sign-in. */
export function AccountsPage() {
  const { data: user } = useMe();
  if (!user) return null;
  const admin = user.roles.includes('admin');
  return (
    <div className="flex max-w-2xl flex-col gap-6">
      <title>Accounts · Scrubline</title>
      <div className="flex flex-col gap-1">
        <h1 className="text-3xl font-extrabold">Accounts</h1>
        <p className="text-ink-muted">
          Everyone with a Scrubline account. A suspended account is signed out everywhere and cannot sign in until it is
          restored; nothing it logged is removed until it is closed for good.
        </p>
      </div>
      {admin ? (
        <SectionBoundary title="Accounts">
          <AccountList currentUserId={user.id} />
        </SectionBoundary>
      ) : (
        <EmptyState message="Only an administrator can see the accounts." />
      )}
    </div>
  );
}
