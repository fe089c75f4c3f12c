import type { WorkOrder } from '@shared/service/work-order.schema';
import { formatDateTime, formatDay } from '@/lib/dates';

/** Who, what car, when, what was asked for, and where the visit stands. */
export function WorkOrderHeader({ workOrder }: { workOrder: WorkOrder }) {
  const closed = workOrder.status === 'closed';
  return (
    <div className="flex flex-col gap-1">
      <p className="text-sm font-semibold text-ink-muted">Work order · {workOrder.shop.name}</p>
      <h1 className="text-3xl font-extrabold wrap-anywhere">{workOrder.carName}</h1>
      <p className="tabular-figures">
        Visit on {formatDay(workOrder.visitDate)} · opened by {workOrder.openedBy.displayName}
      </p>
      <p className="wrap-anywhere whitespace-pre-line">
        <span className="font-semibold">Requested work: </span>
        {workOrder.requestedWork}
      </p>
      {workOrder.notes ? <p className="text-sm wrap-anywhere whitespace-pre-line text-ink-muted">{workOrder.notes}</p> : null}
      <p className="font-bold" aria-label="Status">
        {closed
          ? `Closed — handed over ${workOrder.handoverAt ? formatDateTime(workOrder.handoverAt) : ''}${
              workOrder.closedBy ? ` by ${workOrder.closedBy.displayName}` : ''
            }`
          : 'Open — work in progress'}
      </p>
    </div>
  );
}
