import { useState } from 'react';
import type { WorkOrder } from '@shared/service/work-order.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { fromLocalInputValue, toLocalInputValue } from '@/lib/dates';
import { useCloseWorkOrder } from '../api/edit-work-order';
import { splitErrors } from '../utils/field-errors';

/** Staff hand the car back: the visit closes and a new setup snapshot is written on the car. */
export function CloseWorkOrderForm({ workOrder }: { workOrder: WorkOrder }) {
  const [handover, setHandover] = useState(() => toLocalInputValue(new Date()));
  const [label, setLabel] = useState('');
  const [localError, setLocalError] = useState<string | null>(null);
  const close = useCloseWorkOrder(workOrder.id);
  const server = splitErrors(close.error);
  return (
    <form
      aria-label="Close and hand over"
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        const handoverAt = fromLocalInputValue(handover);
        setLocalError(handoverAt ? null : 'Enter the handover date and time');
        if (!handoverAt) return;
        close.mutate({ handoverAt, ...(label.trim() ? { label: label.trim() } : {}) });
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
        onChange={(e) => setHandover(e.target.value)}
      />
      <TextField
        label="Setup label (optional)"
        hint={`By default “${workOrder.shop.name}: ${workOrder.requestedWork.slice(0, 40)}”`}
        value={label}
        maxLength={80}
        error={server.fields.label}
        onChange={(e) => setLabel(e.target.value)}
      />
      <FormAlert message={server.form} />
      <Button type="submit" isPending={close.isPending} pendingLabel="Closing…" className="self-start">
        Close and hand over
      </Button>
    </form>
  );
}
