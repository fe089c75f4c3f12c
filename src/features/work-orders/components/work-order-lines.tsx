import { useState } from 'react';
import { Plus, Trash2 } from 'lucide-react';
import type { LineKind, WorkOrder } from '@shared/service/work-order.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { UnitInput } from '@/components/ui/unit-input';
import { parseDecimal } from '@/lib/numbers';
import { useReplaceLines } from '../api/edit-work-order';
import { splitErrors } from '../utils/field-errors';
import { centsToMajorText, formatMoney, majorToCents } from '@/lib/money';

const KIND_WORDS: Record<LineKind, string> = { part: 'Part', labour: 'Labour' };

/** Parts and labour as everyone reads them, with the totals. */
export function LinesTable({ workOrder, currency }: { workOrder: WorkOrder; currency: string }) {
  if (workOrder.lines.length === 0) return <p className="text-ink-muted">No parts or labour recorded yet.</p>;
  return (
    <table className="tabular-figures w-full text-left text-sm">
      <caption className="sr-only">Parts and labour</caption>
      <thead>
        <tr className="border-b border-line">
          <th scope="col" className="py-1 pr-2">What</th>
          <th scope="col" className="py-1 pr-2 text-right">Qty / hours</th>
          <th scope="col" className="py-1 pr-2 text-right">Price / rate</th>
          <th scope="col" className="py-1 text-right">Amount</th>
        </tr>
      </thead>
      <tbody>
        {workOrder.lines.map((line, i) => (
          <tr key={i} className="border-b border-line">
            <td className="py-1 pr-2 break-words">
              <span className="text-ink-muted">{KIND_WORDS[line.kind]}:</span> {line.description}
            </td>
            <td className="py-1 pr-2 text-right">{line.kind === 'labour' ? `${line.quantity} h` : line.quantity}</td>
            <td className="py-1 pr-2 text-right">
              {formatMoney(line.unitPriceCents, currency)}
              {line.kind === 'labour' ? '/h' : ''}
            </td>
            <td className="py-1 text-right">{formatMoney(line.totalCents, currency)}</td>
          </tr>
        ))}
      </tbody>
      <tfoot>
        <tr>
          <th scope="row" colSpan={3} className="py-1 pr-2 text-right font-semibold">Parts</th>
          <td className="py-1 text-right">{formatMoney(workOrder.totals.partsCents, currency)}</td>
        </tr>
        <tr>
          <th scope="row" colSpan={3} className="py-1 pr-2 text-right font-semibold">Labour</th>
          <td className="py-1 text-right">{formatMoney(workOrder.totals.labourCents, currency)}</td>
        </tr>
        <tr>
          <th scope="row" colSpan={3} className="py-1 pr-2 text-right font-bold">Subtotal</th>
          <td className="py-1 text-right font-bold">{formatMoney(workOrder.totals.subtotalCents, currency)}</td>
        </tr>
      </tfoot>
    </table>
  );
}

interface Row {
  key: string;
  kind: LineKind;
  description: string;
  quantity: string;
  price: string;
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
    })),
  );
  const [localErrors, setLocalErrors] = useState<Record<string, string>>({});
  const save = useReplaceLines(workOrder.id);
  const server = splitErrors(save.error);
  const errorOf = (i: number, field: string) => localErrors[`lines.${i}.${field}`] ?? server.fields[`lines.${i}.${field}`];
  const symbol = currency.toUpperCase();

  const update = (key: string, patch: Partial<Row>) => setRows((rs) => rs.map((r) => (r.key === key ? { ...r, ...patch } : r)));
  const add = (kind: LineKind) => setRows((rs) => [...rs, { key: crypto.randomUUID(), kind, description: '', quantity: kind === 'part' ? '1' : '', price: '' }]);

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
      {rows.length === 0 ? <p className="text-ink-muted">No lines yet. Add the parts fitted and the time spent.</p> : null}
      <ol className="flex flex-col gap-3">
        {rows.map((row, i) => (
          <li key={row.key}>
            <fieldset className="flex flex-col gap-2 rounded border border-line p-3" aria-label={`Line ${i + 1}`}>
              <legend className="px-1 text-sm font-bold">
                {KIND_WORDS[row.kind]} {i + 1}
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
