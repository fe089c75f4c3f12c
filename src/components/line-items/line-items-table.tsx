import type { LineKind } from '@shared/service/work-order.schema';
import { formatMoney } from '@/lib/money';
import { cn } from '@/lib/cn';

/** One priced line: a part is quantity × price each; labour is hours × rate. */
export interface LineItem {
  kind: LineKind;
  description: string;
  quantity: number;
  unitPriceCents: number;
  /** A part used up in the work (fluid, supplies): billed but not fitted to the car. */
  usedUp: boolean;
  amountCents: number;
}

/** A row under the lines: its name and amount; `total` is the bottom line, `strong` a sum before it. */
export interface LineTotal {
  label: string;
  cents: number;
  weight?: 'normal' | 'strong' | 'total';
}

export const LINE_KIND_WORDS: Record<LineKind, string> = { part: 'Part', labour: 'Labour' };

/** How a used-up part reads beside its description, so nobody takes it for something fitted to the car. */
const USED_UP_MARK = ' (used up in the work)';

const WEIGHT_CLASSES = { normal: 'font-semibold', strong: 'font-bold', total: 'text-lg font-extrabold' } as const;

/** Parts and labour with their sums: the work order's lines and the invoice's, read the same way. */
export function LineItemsTable({ caption, lines, totals, currency }: { caption: string; lines: readonly LineItem[]; totals: readonly LineTotal[]; currency: string }) {
  const money = (cents: number) => formatMoney(cents, currency);
  return (
    <table className="tabular-figures w-full text-left text-sm">
      <caption className="sr-only">{caption}</caption>
      <thead>
        <tr className="border-b border-line">
          <th scope="col" className="py-1 pr-2">What</th>
          <th scope="col" className="py-1 pr-2 text-right">Qty / hours</th>
          <th scope="col" className="py-1 pr-2 text-right">Price / rate</th>
          <th scope="col" className="py-1 text-right">Amount</th>
        </tr>
      </thead>
      <tbody>
        {lines.map((line, i) => (
          <tr key={i} className="border-b border-line">
            <td className="py-1 pr-2 wrap-anywhere">
              <span className="text-ink-muted">{LINE_KIND_WORDS[line.kind]}:</span> {line.description}
              {line.usedUp ? USED_UP_MARK : ''}
            </td>
            <td className="py-1 pr-2 text-right">{line.kind === 'labour' ? `${line.quantity} h` : line.quantity}</td>
            <td className="py-1 pr-2 text-right">
              {money(line.unitPriceCents)}
              {line.kind === 'labour' ? '/h' : ''}
            </td>
            <td className="py-1 text-right">{money(line.amountCents)}</td>
          </tr>
        ))}
      </tbody>
      <tfoot>
        {totals.map(({ label, cents, weight = 'normal' }) => (
          <tr key={label}>
            <th scope="row" colSpan={3} className={cn('py-1 pr-2 text-right', WEIGHT_CLASSES[weight])}>
              {label}
            </th>
            <td className={cn('py-1 text-right', weight === 'normal' ? '' : WEIGHT_CLASSES[weight])}>{money(cents)}</td>
          </tr>
        ))}
      </tfoot>
    </table>
  );
}
