import { useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { SelectField } from '@/components/ui/select-field';
import { useMe } from '@/features/auth/api/get-me';
import { useMyShops } from '@/features/shops/api/get-my-shops';
import { useShop } from '@/features/shops/api/get-shop';
import { CustomerList } from '@/features/shops/components/customer-list';
import { StaffSection } from '@/features/shops/components/staff-section';
import { StartShopForm } from '@/features/shops/components/start-shop-form';
import { ShopSettingsForm, ShopSettingsSummary } from '@/features/shops/components/shop-settings';
import { workOrderKeys } from '@/features/work-orders/api/work-order-keys';
import { ShopBoard } from '@/features/work-orders/components/work-order-lists';
import { InvoiceBook } from '@/features/invoices/components/invoice-book';
import { refreshAfterWrite } from '@/lib/refresh-after-write';
import { CardSection } from '@/components/layouts/card-section';

const SHOP_PARAM = 'shop';

function StaffCard({ shopId, currentUserId }: { shopId: string; currentUserId: string }) {
  const { data: shop, isPending, isError } = useShop(shopId);
  if (isPending) return <p className="text-ink-muted">Loading staff…</p>;
  if (isError) return <p className="text-ink-muted">The staff list could not be loaded. Try again shortly.</p>;
  return <StaffSection shop={shop} currentUserId={currentUserId} />;
}

function SettingsCard({ shopId }: { shopId: string }) {
  const queryClient = useQueryClient();
  const { data: shop, isPending, isError } = useShop(shopId);
  if (isPending) return <p className="text-ink-muted">Loading the settings…</p>;
  if (isError) return <p className="text-ink-muted">The settings could not be loaded. Try again shortly.</p>;
  if (!shop.isShopAdmin) return <ShopSettingsSummary shop={shop} />;
  return (
    // Open work orders read their amounts in the shop's currency and their checks against its tolerance.
    <ShopSettingsForm shop={shop} onSaved={() => void refreshAfterWrite(queryClient, { queryKey: workOrderKeys.all })} />
  );
}

/** Shop staff: the cars the shop looks after, and who works there. With no shop, how to open one. */
export function ShopPage() {
  const { data: me } = useMe();
  const mine = useMyShops();
  const [params, setParams] = useSearchParams();
  const shops = mine.data?.items ?? [];
  const shop = shops.find((s) => s.id === params.get(SHOP_PARAM)) ?? shops[0];

  if (!me) return null;
  if (mine.isPending) return <p className="text-ink-muted">Loading your shop…</p>;
  if (mine.isError) return <p className="text-ink-muted">Your shops could not be loaded. Try again shortly.</p>;

  if (!shop) {
    return (
      <div className="flex max-w-form flex-col gap-6">
        <title>Shop · Scrubline</title>
        <div className="flex flex-col gap-2">
          <h1 className="text-3xl font-extrabold">Your shop</h1>
          <p className="text-ink-muted">
            You do not work for a shop here yet. If a shop has invited you, open the link in the invitation e-mail. Or open your own
            shop: drivers then let it see their cars, and you can comment and suggest setups.
          </p>
        </div>
        <StartShopForm onCreated={(created) => setParams({ [SHOP_PARAM]: created.id }, { replace: true })} />
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-6">
      <title>{`${shop.name} · Scrubline`}</title>
      <div className="flex flex-col gap-2">
        <h1 className="text-3xl font-extrabold wrap-anywhere">{shop.name}</h1>
        <p className="text-ink-muted">{shop.isShopAdmin ? 'You are a shop admin.' : 'You are on the staff.'}</p>
        {shops.length > 1 ? (
          <SelectField
            className="max-w-form"
            label="Shop"
            value={shop.id}
            options={shops.map((s) => ({ value: s.id, label: s.name }))}
            onChange={(e) => setParams({ [SHOP_PARAM]: e.target.value }, { replace: true })}
          />
        ) : null}
      </div>
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-2">
        <CardSection title="Open work orders">
          <ShopBoard shopId={shop.id} />
        </CardSection>
        <CardSection title="Customers">
          <CustomerList shopId={shop.id} />
        </CardSection>
        <CardSection title="Closed visits">
          <ShopBoard shopId={shop.id} status="closed" />
        </CardSection>
        <CardSection title="Invoices">
          <InvoiceBook shopId={shop.id} />
        </CardSection>
        <CardSection title="Staff">
          <StaffCard shopId={shop.id} currentUserId={me.id} />
        </CardSection>
        <CardSection title="Invoices and build sheets">
          <SettingsCard shopId={shop.id} />
        </CardSection>
      </div>
    </div>
  );
}
