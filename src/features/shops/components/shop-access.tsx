import { useId, useState } from 'react';
import { Search } from 'lucide-react';
import type { ShopGrant, ShopSummary } from '@shared/collab/shop.schema';
import { ConfirmButton, refusalText } from '@/components/dialogs/confirm-button';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { formatDay } from '@/lib/dates';
import { useShopGrants } from '../api/get-shop-grants';
import { useGrantShop } from '../api/grant-shop';
import { useRevokeShop } from '../api/revoke-shop';
import { useShopSearch } from '../api/search-shops';


function RevokeShop({ carId, shop }: { carId: string; shop: ShopSummary }) {
  const revoke = useRevokeShop(carId);
  return (
    <ConfirmButton
      title={`Revoke ${shop.name}’s access?`}
      destructive
      description="Its staff will no longer see this car’s season, comment or suggest setups. Their past comments and suggestions stay. You can let the shop in again later."
      confirmLabel="Revoke access"
      pendingLabel="Revoking…"
      keepLabel="Keep"
      isPending={revoke.isPending}
      onConfirm={(handlers) => revoke.mutate(shop.id, handlers)}
      failureText={refusalText}
    >
      Revoke<span className="sr-only"> {shop.name}</span>
    </ConfirmButton>
  );
}

function GrantShopForm({ carId, granted }: { carId: string; granted: readonly string[] }) {
  const inputId = useId();
  const [q, setQ] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const search = useShopSearch(q);
  const grant = useGrantShop(carId);
  const results = (search.data?.items ?? []).filter((s) => !granted.includes(s.id));
  const typed = q.trim().length >= 2;

  return (
    <div className="flex flex-col gap-2">
      <label htmlFor={inputId} className="font-semibold">
        Find a shop
      </label>
      <p className="text-sm text-ink-muted">Type at least two letters of the shop’s name.</p>
      <div className="flex min-h-tap items-center rounded border border-line-strong bg-surface focus-within:outline-3 focus-within:outline-offset-2 focus-within:outline-focus">
        <Search aria-hidden="true" className="ml-3 size-5 shrink-0 text-ink-muted" />
        <input
          id={inputId}
          type="search"
          autoComplete="off"
          value={q}
          onChange={(e) => {
            setQ(e.target.value);
            setDone(null);
            setError(null);
          }}
          className="min-h-tap w-full min-w-0 bg-transparent px-3 text-base text-ink outline-none"
        />
      </div>
      {typed ? (
        search.isError ? (
          <p className="text-sm text-ink-muted">{refusalText(search.error)}</p>
        ) : search.isPending ? (
          <p className="text-sm text-ink-muted">Searching…</p>
        ) : results.length === 0 ? (
          <p className="text-sm text-ink-muted">No shop by that name (or it already has access).</p>
        ) : (
          <ul className="flex flex-col gap-2" aria-label="Shops found">
            {results.map((shop) => (
              <li key={shop.id} className="flex min-h-tap flex-wrap items-center justify-between gap-2 rounded border border-line px-3 py-1">
                <span className="min-w-0 font-semibold wrap-anywhere">{shop.name}</span>
                <Button
                  variant="secondary"
                  isPending={grant.isPending && grant.variables?.shopId === shop.id}
                  pendingLabel="Granting…"
                  onClick={() => {
                    setError(null);
                    grant.mutate(
                      { shopId: shop.id },
                      {
                        onSuccess: () => {
                          setDone(`${shop.name} can now see this car’s season.`);
                          setQ('');
                        },
                        onError: (e) => setError(refusalText(e)),
                      },
                    );
                  }}
                >
                  Grant access<span className="sr-only"> to {shop.name}</span>
                </Button>
              </li>
            ))}
          </ul>
        )
      ) : null}
      <FormAlert message={error} />
      <p role="status" className="text-sm font-semibold text-success">
        {done}
      </p>
    </div>
  );
}

function GrantItem({ grant, carId, isOwner }: { grant: ShopGrant; carId: string; isOwner: boolean }) {
  return (
    <li className="flex min-h-tap flex-wrap items-center justify-between gap-2 rounded border border-line px-3 py-2">
      <span className="flex min-w-0 flex-col">
        <span className="font-semibold wrap-anywhere">{grant.shop.name}</span>
        <span className="text-sm text-ink-muted">
          Access given {formatDay(grant.createdAt)} by {grant.grantedBy.displayName}
        </span>
      </span>
      {isOwner ? <RevokeShop carId={carId} shop={grant.shop} /> : null}
    </li>
  );
}

/**
 * Which shops may see the car's season. The owner lets shops in and takes them out; co-drivers
 * see the list.
 */
export function ShopAccess({ carId, isOwner, ownerName }: { carId: string; isOwner: boolean; ownerName: string }) {
  const { data, isPending, isError } = useShopGrants(carId);
  const grants = data?.items ?? [];
  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm">
        A shop you let in can see this car’s season, comment on it and suggest setup changes for you to accept or decline; it can
        never edit your runs or setups.
      </p>
      {isPending ? (
        <p className="text-ink-muted">Loading shop access…</p>
      ) : isError ? (
        <p className="text-ink-muted">Shop access could not be loaded. Try again shortly.</p>
      ) : grants.length === 0 ? (
        <p className="text-sm text-ink-muted">No shop can see this car.</p>
      ) : (
        <ul className="flex flex-col gap-2" aria-label="Shops with access">
          {grants.map((grant) => (
            <GrantItem key={grant.shop.id} grant={grant} carId={carId} isOwner={isOwner} />
          ))}
        </ul>
      )}
      {isOwner ? (
        <GrantShopForm carId={carId} granted={grants.map((g) => g.shop.id)} />
      ) : (
        <p className="text-sm text-ink-muted">Only the owner, {ownerName}, can let shops in or take them out.</p>
      )}
    </div>
  );
}
