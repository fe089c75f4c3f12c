import { useEffect, useId, useRef, useState } from 'react';
import { TriangleAlert } from 'lucide-react';
import type { WorkOrder } from '@shared/service/work-order.schema';
import { handoverLabel, SETUP_LABEL_MAX } from '@shared/service/handover-label';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { formatDateTime, fromLocalInputValue, toLocalInputValue } from '@/lib/dates';
import { useUnits } from '@/lib/units-context';
import { CORNER_NAMES } from '@/components/corner-grid/corner-grid';
import { useSetups } from '@/features/setups/api/get-setups';
import { useCloseWorkOrder } from '../api/edit-work-order';
import { buildSheetAttention } from '../utils/build-sheet-checks';
import { splitErrors } from '../utils/field-errors';

/**
 * Staff hand the car back: the visit closes and a new setup snapshot is written on the car. Closing cannot be undone,
 * so it is asked twice. The question lists first what may need another look (failed build-sheet checks, corners of the
 * sheet left empty), and a handover dated before setups the driver has recorded since; closing is still allowed, since a
 * visit may be for one corner only.
 */
export function CloseWorkOrderForm({ workOrder }: { workOrder: WorkOrder }) {
  const [handover, setHandover] = useState(() => toLocalInputValue(new Date()));
  const [label, setLabel] = useState('');
  const [localError, setLocalError] = useState<string | null>(null);
  const [asking, setAsking] = useState<string | null>(null);
  // The question replaces the button that asked it: the focus goes to its answer, and back when it is put away.
  const yesRef = useRef<HTMLButtonElement>(null);
  const askRef = useRef<HTMLButtonElement>(null);
  const asked = useRef(false);
  useEffect(() => {
    if (asking) yesRef.current?.focus();
    else if (asked.current) askRef.current?.focus();
    asked.current = asking !== null;
  }, [asking]);
  const units = useUnits();
  const attentionId = useId();
  const close = useCloseWorkOrder(workOrder.id);
  const { data: setups } = useSetups(workOrder.carId);
  const server = splitErrors(close.error, ['handoverAt', 'label']);
  const byDefault = handoverLabel(workOrder.shop.name, workOrder.requestedWork);
  // Setups starting after the handover keep their own values; the one written now slots in before them.
  const attention = asking ? buildSheetAttention(workOrder, units) : [];
  const later = asking ? (setups?.items ?? []).filter((s) => s.effectiveFrom > asking) : [];

  return (
    <form
      aria-label="Close and hand over"
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        const handoverAt = fromLocalInputValue(handover);
        setLocalError(handoverAt ? null : 'Enter the handover date and time');
        if (!handoverAt) return;
        if (asking !== handoverAt) {
          setAsking(handoverAt);
          return;
        }
        close.mutate({ handoverAt, ...(label.trim() ? { label: label.trim() } : {}) }, { onSettled: () => setAsking(null) });
      }}
    >
      <p className="text-sm text-ink-muted">
        Closing writes the after measurements as a new setup snapshot on the car, dated at the handover. The driver’s own snapshots
        and runs stay as they are. The work order cannot be edited afterwards.
      </p>
      <TextField
        label="Handover"
        type="datetime-local"
        value={handover}
        error={localError ?? server.fields.handoverAt}
        onChange={(e) => {
          setHandover(e.target.value);
          setAsking(null);
        }}
      />
      <TextField
        label="Setup label (optional)"
        hint={`By default “${byDefault}”`}
        value={label}
        maxLength={SETUP_LABEL_MAX}
        error={server.fields.label}
        onChange={(e) => setLabel(e.target.value)}
      />
      <FormAlert message={server.form} />
      {asking ? (
        <div
          role="group"
          aria-label="Confirm the handover"
          aria-describedby={attention.length > 0 ? attentionId : undefined}
          className="flex flex-col gap-3 rounded border-2 border-accent p-3">
          {attention.length > 0 ? (
            <div id={attentionId} className="flex items-start gap-2 text-sm text-warning">
              <TriangleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
              <div className="flex flex-col gap-1">
                <p className="font-bold">Check the build sheet first:</p>
                <ul className="list-disc pl-4 font-semibold">
                  {attention.map((a) => (
                    <li key={`${a.corner}-${a.text}`}>
                      {CORNER_NAMES[a.corner]}: {a.text}
                    </li>
                  ))}
                </ul>
                <p className="text-ink">Choose “Not yet” to go back, or close anyway if the work was on some corners only.</p>
              </div>
            </div>
          ) : null}
          <p className="font-semibold">
            Close this visit for good? “{label.trim() || byDefault}” becomes {workOrder.carName}’s setup from {formatDateTime(asking)}.
          </p>
          {later.length > 0 ? (
            <p className="text-sm font-semibold text-warning">
              {later.length === 1 ? 'One setup on the car starts' : `${later.length} setups on the car start`} later (the latest “{later[0]!.label}”, from{' '}
              {formatDateTime(later[0]!.effectiveFrom)}). The handover slots in before{' '}
              {later.length === 1 ? 'it, and that setup' : 'them, and they'} will read as changed from the handover. Check the date before you close.
            </p>
          ) : null}
          <div className="flex flex-wrap gap-2">
            <Button ref={yesRef} type="submit" isPending={close.isPending} pendingLabel="Closing…">
              Yes, close and hand over
            </Button>
            <Button variant="secondary" onClick={() => setAsking(null)}>
              Not yet
            </Button>
          </div>
        </div>
      ) : (
        <Button ref={askRef} type="submit" className="self-start">
          Close and hand over…
        </Button>
      )}
    </form>
  );
}
