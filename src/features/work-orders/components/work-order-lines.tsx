import { useId, useState } from 'react';
import { Plus, Trash2 } from 'lucide-react';
import type { LineKind, WorkOrder } from '@shared/service/work-order.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { UnitInput } from '@/components/ui/unit-input';
import { parseDecimal } from '@/lib/numbers';
import { useReplaceLines } from '../api/edit-work-order';
import { splitErrors } from '../utils/field-errors';
import { centsToMajorText, majorToCents } from '@/lib/money';
import { invoiceTotals } from '@shared/calc/invoice.calc';
import { LINE_KIND_WORDS, LineItemsTable } from '@/components/line-items/line-items-table';
import { cn } from '@/lib/cn';

/** "8.25 %": the rate as the shop set it. */
const percent = (rate: number) => `${new Intl.NumberFormat('en', { maximumFractionDigits: 4 }).format(rate)} %`;

/** Under the table when a part was used up: why it is billed but missing from the car's change log. */
function UsedUpNote({ workOrder }: { workOrder: WorkOrder }) {
  if (!workOrder.lines.some((l) => l.usedUp)) return null;
  return (
    <p className="text-sm text-ink-muted">
      Parts marked “used up” were consumed in the work (fluids, supplies): they are billed, but they are not changes to the car,
      so the car’s change log lists only the parts fitted.
    </p>
  );
}

/**
 * Parts and labour as everyone reads them, with the totals. While the visit is open, a running estimate: each line's
 * amount, the subtotal, tax at the shop's rate and the total, worked out as the invoice will be (invoiceTotals).
 */
export function LinesTable({ workOrder, currency }: { workOrder: WorkOrder; currency: string }) {
  if (workOrder.lines.length === 0) return <p className="text-ink-muted">No parts or labour recorded yet.</p>;
  const { partsCents, labourCents } = workOrder.totals;
  if (workOrder.status === 'open') {
    const estimate = invoiceTotals(workOrder.lines, workOrder.shop.taxRatePct);
    return (
      <div className="flex flex-col gap-2">
        <p className="text-sm font-semibold text-ink-muted">Estimate: the amounts are final once the work order is closed and invoiced.</p>
        <LineItemsTable
          caption="Parts and labour, estimate"
          currency={currency}
          lines={workOrder.lines.map((l, i) => ({ ...l, amountCents: estimate.lineCents[i]! }))}
          totals={[
            { label: 'Parts', cents: partsCents },
            { label: 'Labour', cents: labourCents },
            { label: 'Subtotal (estimate)', cents: estimate.subtotalCents, weight: 'strong' },
            {
              // A shop that has set no rate is not said to charge 0 % tax.
              label: workOrder.shop.taxRatePct ? `Tax at ${percent(workOrder.shop.taxRatePct)} (estimate)` : 'Tax: no rate set by the shop',
              cents: estimate.taxCents,
            },
            { label: 'Estimated total', cents: estimate.totalCents, weight: 'total' },
          ]}
        />
        <UsedUpNote workOrder={workOrder} />
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-2">
      <LineItemsTable
        caption="Parts and labour"
        currency={currency}
        lines={workOrder.lines.map((l) => ({ ...l, amountCents: l.totalCents }))}
        totals={[
          { label: 'Parts', cents: partsCents },
          { label: 'Labour', cents: labourCents },
          { label: 'Subtotal', cents: workOrder.totals.subtotalCents, weight: 'strong' },
        ]}
      />
      <UsedUpNote workOrder={workOrder} />
    </div>
  );
}

const PART_USES = [
  { usedUp: false, label: 'Stays on the car', hint: 'Fitted, like arms or springs: it goes into the car’s change log.' },
  { usedUp: true, label: 'Used up in the work', hint: 'Like brake fluid, thread locker or shop supplies: billed only.' },
] as const;

/**
 * Whether a part stays on the car or is used up in the work: two large radio buttons side by side (48 px tall, the
 * whole box tappable), each named by its short label; the chosen one's example shows once under both, so the
 * choice stays short on a phone. Each radio is still described by its own example, shown or not.
 */
function PartUseChoice({ usedUp, error, onChange }: { usedUp: boolean; error?: string; onChange: (usedUp: boolean) => void }) {
  const id = useId();
  return (
    <fieldset className="flex min-w-0 flex-col gap-1" aria-describedby={error ? `${id}-error` : undefined}>
      <legend className="mb-1 text-sm font-semibold">After the work, this part is</legend>
      <div className="grid grid-cols-2 gap-2">
        {PART_USES.map((use) => {
          const checked = use.usedUp === usedUp;
          const key = use.usedUp ? 'used-up' : 'stays';
          return (
            <label
              key={key}
              className={cn(
                // The same border width either way, so choosing moves nothing.
                'flex min-h-12 cursor-pointer items-center gap-2 rounded border-2 px-2 py-1',
                checked ? 'border-accent bg-accent-soft' : 'border-line-strong bg-surface',
              )}
            >
              <input
                type="radio"
                name={id}
                className="size-5 shrink-0"
                checked={checked}
                aria-labelledby={`${id}-${key}`}
                aria-describedby={`${id}-${key}-hint`}
                onChange={() => onChange(use.usedUp)}
              />
              <span id={`${id}-${key}`} className="text-sm font-semibold leading-tight">
                {use.label}
              </span>
            </label>
          );
        })}
      </div>
      {PART_USES.map((use) => (
        <p key={String(use.usedUp)} id={`${id}-${use.usedUp ? 'used-up' : 'stays'}-hint`} hidden={use.usedUp !== usedUp} className="text-sm text-ink-muted">
          {use.hint}
        </p>
      ))}
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-warning">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}

interface Row {
  key: string;
  kind: LineKind;
  description: string;
  quantity: string;
  price: string;
  /** Parts only: used up in the work rather than fitted. */
  usedUp: boolean;
}

/** Staff edit the lines: a part is description × quantity × price; labour is description × hours × rate. */
export function LinesEditor({ workOrder, currency }: { workOrder: WorkOrder; currency: string }) {
  const [rows, setRows] = useState<Row[]>(() =>
    workOrder.lines.map((l) => ({
      key: crypto.randomUUID(),
      kind: l.kind,
      description: l.description,
      quantity: String(l.quantity),
      price: centsToMajorText(l.unitPriceCents, currency),
      usedUp: l.kind === 'part' && l.usedUp,
    })),
  );
  const [localErrors, setLocalErrors] = useState<Record<string, string>>({});
  const save = useReplaceLines(workOrder.id);
  const server = splitErrors(save.error);
  const errorOf = (i: number, field: string) => localErrors[`lines.${i}.${field}`] ?? server.fields[`lines.${i}.${field}`];
  const symbol = currency.toUpperCase();

  const update = (key: string, patch: Partial<Row>) => setRows((rs) => rs.map((r) => (r.key === key ? { ...r, ...patch } : r)));
  const add = (kind: LineKind) => setRows((rs) => [...rs, { key: crypto.randomUUID(), kind, description: '', quantity: kind === 'part' ? '1' : '', price: '', usedUp: false }]);

  const submit = () => {
    const errors: Record<string, string> = {};
    const lines = rows.map((r, i) => {
      const q = parseDecimal(r.quantity);
      const cents = majorToCents(r.price, currency);
      if (q.kind !== 'number') errors[`lines.${i}.quantity`] = r.kind === 'labour' ? 'Enter the hours' : 'Enter the quantity';
      if (cents === null || cents === 'invalid') errors[`lines.${i}.unitPriceCents`] = `Enter the price in ${symbol}, e.g. 12.50`;
      return {
        kind: r.kind,
        description: r.description,
        quantity: q.kind === 'number' ? q.value : 0,
        unitPriceCents: typeof cents === 'number' ? cents : 0,
        // Labour is never used up, so it does not say.
        ...(r.kind === 'part' ? { usedUp: r.usedUp } : {}),
      };
    });
    setLocalErrors(errors);
    if (Object.keys(errors).length > 0) return;
    save.mutate({ lines });
  };

  return (
    <form
      className="flex flex-col gap-3"
      aria-label="Parts and labour"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      {rows.length === 0 ? <p className="text-ink-muted">No lines yet. Add the parts and the time spent.</p> : null}
      <ol className="flex flex-col gap-3">
        {rows.map((row, i) => (
          <li key={row.key}>
            <fieldset className="flex flex-col gap-2 rounded border border-line p-3" aria-label={`Line ${i + 1}`}>
              <legend className="px-1 text-sm font-bold">
                {LINE_KIND_WORDS[row.kind]} {i + 1}
              </legend>
              <TextField
                label="Description"
                value={row.description}
                maxLength={200}
                error={errorOf(i, 'description')}
                onChange={(e) => update(row.key, { description: e.target.value })}
              />
              <div className="grid grid-cols-2 gap-2">
                <UnitInput
                  label={row.kind === 'labour' ? 'Hours' : 'Quantity'}
                  unit={row.kind === 'labour' ? 'h' : 'pcs'}
                  value={row.quantity}
                  error={errorOf(i, 'quantity')}
                  onChange={(e) => update(row.key, { quantity: e.target.value })}
                />
                <UnitInput
                  label={row.kind === 'labour' ? 'Rate per hour' : 'Price each'}
                  unit={symbol}
                  value={row.price}
                  error={errorOf(i, 'unitPriceCents')}
                  onChange={(e) => update(row.key, { price: e.target.value })}
                />
              </div>
              {row.kind === 'part' ? (
                <PartUseChoice usedUp={row.usedUp} error={errorOf(i, 'usedUp')} onChange={(usedUp) => update(row.key, { usedUp })} />
              ) : null}
              <Button variant="quiet" className="self-start" onClick={() => setRows((rs) => rs.filter((r) => r.key !== row.key))}>
                <Trash2 aria-hidden="true" className="size-4" /> Remove line {i + 1}
              </Button>
            </fieldset>
          </li>
        ))}
      </ol>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={() => add('part')}>
          <Plus aria-hidden="true" className="size-4" /> Add a part
        </Button>
        <Button variant="secondary" onClick={() => add('labour')}>
          <Plus aria-hidden="true" className="size-4" /> Add labour
        </Button>
      </div>
      <FormAlert message={server.form ?? server.fields.lines ?? null} />
      <Button type="submit" isPending={save.isPending} pendingLabel="Saving…" className="self-start">
        Save parts and labour
      </Button>
      {save.isSuccess && !save.isPending ? <p role="status" className="text-sm text-ink-muted">Saved.</p> : null}
    </form>
  );
}
