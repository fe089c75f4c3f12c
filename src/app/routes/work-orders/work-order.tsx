import { Link, useParams } from 'react-router-dom';
import { Printer } from 'lucide-react';
import { pathTo } from '@/config/paths';
import { recordPath } from '@/config/record-paths';
import { Button, buttonClasses } from '@/components/ui/button';
import { PageMessage } from '@/components/ui/page-message';
import { SectionCard } from '@/components/ui/section-card';
import { SectionBoundary } from '@/components/errors/section-boundary';
import { isApiError } from '@/lib/api-client';
import { CommentToggle } from '@/features/comments/components/comment-toggle';
import { useMyShops } from '@/features/shops/api/get-my-shops';
import { useWorkOrder } from '@/features/work-orders/api/get-work-order';
import { BuildSheetEditor, BuildSheetView, BuildSheetCautions } from '@/features/work-orders/components/build-sheet';
import { CloseWorkOrderForm } from '@/features/work-orders/components/close-work-order-form';
import { MeasurementsForm, MeasurementsView } from '@/features/work-orders/components/measurements';
import { HandoverCautions, MeasurementCautions } from '@/features/work-orders/components/work-cautions';
import { LinesEditor, LinesTable } from '@/features/work-orders/components/work-order-lines';
import { WorkOrderHeader } from '@/features/work-orders/components/work-order-header';
import { InvoiceSection } from '@/features/invoices/components/invoice-section';
import { CardSection } from '@/components/layouts/card-section';
import { BackLink } from '@/components/ui/back-link';

/** One shop visit: staff of the shop edit it while it is open; the car's drivers read it and comment. */
export function WorkOrderPage() {
  const { workOrderId = '' } = useParams();
  const { data: workOrder, isPending, isError, error } = useWorkOrder(workOrderId);
  const myShops = useMyShops();
  const isStaff = Boolean(workOrder && myShops.data?.items.some((s) => s.id === workOrder.shop.id));

  if (isPending) return <p className="text-ink-muted">Loading the work order…</p>;
  if (isError) {
    const missing = isApiError(error) && error.status === 404;
    return (
      <PageMessage variant="in-shell" title={missing ? 'Work order not found' : 'The work order could not be loaded'}>
        <p>{missing ? 'It may be for a car you no longer have access to.' : 'Try again when you have signal.'}</p>
      </PageMessage>
    );
  }

  const canEdit = isStaff && workOrder.status === 'open';
  const currency = workOrder.shop.currency;
  const back = isStaff ? recordPath.shopCustomer(workOrder.carId) : pathTo.car(workOrder.carId);

  return (
    <div className="handover-sheet flex max-w-3xl flex-col gap-6 print:max-w-none print:gap-1">
      <title>{`${workOrder.carName}: work order · Scrubline`}</title>
      <div className="flex flex-col gap-2">
        <BackLink to={back} className="print:hidden">{workOrder.carName}</BackLink>
        <WorkOrderHeader workOrder={workOrder} />
        {workOrder.setupId ? (
          <Link to={`${back}#setup-${workOrder.setupId}`} className={buttonClasses('secondary', 'self-start print:hidden')}>
            See the setup snapshot it wrote
          </Link>
        ) : null}
        <Button variant="secondary" className="self-start print:hidden" onClick={() => window.print()}>
          <Printer aria-hidden="true" className="size-4" /> Print the handover sheet
        </Button>
      </div>

      <CardSection title="Measurements">
        {/* The handover's own caution below is what the customer's sheet carries; this one is for the work. */}
        <div className="print:hidden">
          <MeasurementCautions />
        </div>
        <MeasurementsView workOrder={workOrder} />
        {/* Each form keeps what is typed in it: saving one section must not wipe another's unsaved values. */}
        {canEdit ? (
          <div className="flex flex-col gap-6 print:hidden">
            <MeasurementsForm workOrder={workOrder} stage="before" />
            <MeasurementsForm workOrder={workOrder} stage="after" />
          </div>
        ) : null}
      </CardSection>

      <CardSection title="Build sheet">
        <BuildSheetCautions />
        {canEdit ? <BuildSheetEditor workOrder={workOrder} /> : <BuildSheetView workOrder={workOrder} />}
      </CardSection>

      <CardSection title="Parts and labour">
        {canEdit ? (
          <>
            {/* The saved lines as a running estimate, above the form that edits them. */}
            <LinesTable workOrder={workOrder} currency={currency} />
            <div className="print:hidden">
              <LinesEditor key={currency} workOrder={workOrder} currency={currency} />
            </div>
          </>
        ) : (
          <LinesTable workOrder={workOrder} currency={currency} />
        )}
      </CardSection>

      <HandoverCautions />

      {canEdit ? (
        <div className="print:hidden">
          <SectionCard title="Close and hand over">
            <CloseWorkOrderForm workOrder={workOrder} />
          </SectionCard>
        </div>
      ) : null}

      {workOrder.status === 'closed' ? (
        <div className="print:hidden">
          <SectionBoundary title="Invoice">
            <InvoiceSection workOrderId={workOrder.id} shopId={workOrder.shop.id} isStaff={isStaff} />
          </SectionBoundary>
        </div>
      ) : null}

      <div className="print:hidden">
        <CommentToggle target={{ type: 'work_order', id: workOrder.id }} what="this work order" />
      </div>
    </div>
  );
}
