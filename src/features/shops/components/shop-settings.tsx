import { useState } from 'react';
import { formatQuantity } from '@shared/calc/units.calc';
import { INVOICE_DETAILS_MAX, updateShopSettingsInputSchema, type Shop } from '@shared/collab/shop.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextArea } from '@/components/ui/text-area';
import { TextField } from '@/components/ui/text-field';
import { UnitInput } from '@/components/ui/unit-input';
import { isApiError } from '@/lib/api-client';
import { inputToSi, parseDecimal, toInputText, typeANumber, unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { useUpdateShopSettings } from '../api/update-shop-settings';

/** What the shop's invoices and build sheets use, in a sentence. */
export function ShopSettingsSummary({ shop }: { shop: Shop }) {
  const units = useUnits();
  const { taxRatePct, currency, compressedLengthToleranceMm } = shop.settings;
  return (
    <p className="text-sm">
      Invoices are in {currency.toUpperCase()} with {taxRatePct} % tax. Build sheets flag a damper whose compressed length is more than{' '}
      {formatQuantity(compressedLengthToleranceMm, 'length', units)} shorter than its reference.
    </p>
  );
}

/**
 * A shop admin sets the invoice tax rate and currency and the build sheet's compressed-length
 * tolerance. Invoices already made keep the rate and currency they were made with.
 */
export function ShopSettingsForm({ shop, onSaved }: { shop: Shop; onSaved?: () => void }) {
  const units = useUnits();
  const [tax, setTax] = useState(String(shop.settings.taxRatePct));
  const [currency, setCurrency] = useState(shop.settings.currency.toUpperCase());
  const [tolerance, setTolerance] = useState(toInputText(shop.settings.compressedLengthToleranceMm, 'length', units));
  const [invoiceDetails, setInvoiceDetails] = useState(shop.settings.invoiceDetails);
  const [localErrors, setLocalErrors] = useState<Record<string, string>>({});
  const save = useUpdateShopSettings(shop.id);
  const serverFields = isApiError(save.error) ? save.error.fieldErrors : {};
  const errorOf = (key: string) => localErrors[key] ?? serverFields[key]?.join(' ');
  const formError =
    save.error && !(isApiError(save.error) && save.error.hasFieldErrors)
      ? isApiError(save.error) && save.error.code === 'network'
        ? 'This needs a connection. Try again when you have signal.'
        : isApiError(save.error)
          ? save.error.message
          : 'Something went wrong; try again.'
      : null;

  const submit = () => {
    const errors: Record<string, string> = {};
    const taxParsed = parseDecimal(tax);
    if (taxParsed.kind !== 'number') errors.taxRatePct = typeANumber('8.25, or 0 if none');
    const toleranceMm = inputToSi(tolerance, 'length', units);
    if (toleranceMm === null || toleranceMm === 'invalid') errors.compressedLengthToleranceMm = typeANumber();
    const input = {
      taxRatePct: taxParsed.kind === 'number' ? taxParsed.value : undefined,
      currency,
      compressedLengthToleranceMm: typeof toleranceMm === 'number' ? toleranceMm : undefined,
      invoiceDetails,
    };
    // The same rules the server applies, so a mistake is shown before anything is sent.
    const checked = updateShopSettingsInputSchema.safeParse(input);
    if (!checked.success) {
      for (const issue of checked.error.issues) errors[String(issue.path[0])] ??= issue.message;
    }
    setLocalErrors(errors);
    if (Object.keys(errors).length > 0 || !checked.success) return;
    save.mutate(checked.data, { onSuccess: () => onSaved?.() });
  };

  return (
    <form
      aria-label="Shop settings"
      className="flex flex-col gap-3"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      {/* One under the other: side by side, the currency's hint above its box set the two boxes at different heights. */}
      <UnitInput label="Tax rate" unit="%" className="max-w-40" value={tax} error={errorOf('taxRatePct')} onChange={(e) => setTax(e.target.value)} />
      <TextField
        label="Currency"
        hint="Three letters, e.g. USD"
        className="max-w-60"
        value={currency}
        maxLength={3}
        autoCapitalize="characters"
        error={errorOf('currency')}
        onChange={(e) => setCurrency(e.target.value.toUpperCase())}
      />
      <UnitInput
        label="Compressed-length tolerance"
        unit={unitSymbol('length', units)}
        hint="How much shorter than the reference a damper may compress before the build sheet flags it; about 13–16 mm is usual."
        value={tolerance}
        error={errorOf('compressedLengthToleranceMm')}
        onChange={(e) => setTolerance(e.target.value)}
      />
      <TextArea
        label="Under the shop’s name on invoices"
        hint="Address, telephone, tax number: what your invoices must carry where you work. Up to 8 lines."
        rows={4}
        maxLength={INVOICE_DETAILS_MAX}
        value={invoiceDetails}
        error={errorOf('invoiceDetails')}
        onChange={setInvoiceDetails}
      />
      <p className="text-sm text-ink-muted">Invoices already made keep the rate, currency and lines they were made with.</p>
      <FormAlert message={formError} />
      <Button type="submit" className="self-start" isPending={save.isPending} pendingLabel="Saving…">
        Save the settings
      </Button>
      {save.isSuccess && !save.isPending ? (
        <p role="status" className="text-sm text-ink-muted">
          Saved.
        </p>
      ) : null}
    </form>
  );
}
