import { Router } from 'express';
import type { DataSource } from 'typeorm';
import * as z from '@shared/zod';
import {
  buildSheetInputSchema, closeWorkOrderInputSchema, createWorkOrderInputSchema, measurementsInputSchema, replaceLinesInputSchema,
  stageSchema, updateWorkOrderInputSchema, workOrderListQuerySchema,
  type BuildSheetInput, type CloseWorkOrderInput, type CreateWorkOrderInput, type MeasurementsInput, type ReplaceLinesInput,
  type Stage, type UpdateWorkOrderInput, type WorkOrderStatus,
} from '@shared/service/work-order.schema';
import { currentUser, requireAuth } from '../../auth/access';
import type { MailSettings } from '../../mail/mailer';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import {
  closeWorkOrder, createWorkOrder, getWorkOrder, listCarWorkOrders, listShopWorkOrders, putBuildSheet, putMeasurements, replaceLines,
  updateWorkOrder,
} from './work-order.service';

/** Routes under /api/cars/:carId/work-orders. */
export function carWorkOrderRoutes(ds: DataSource) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const carParam = idParam('carId');

  router.post('/', validate({ params: carParam, body: createWorkOrderInputSchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    const { workOrder, created } = await createWorkOrder(ds, currentUser(req), carId, parsed<CreateWorkOrderInput>(res, 'body'));
    res.status(created ? 201 : 200).json(workOrder);
  });
  router.get('/', validate({ params: carParam }), async (req, res) => {
    res.json(list(await listCarWorkOrders(ds, currentUser(req), parsed<{ carId: string }>(res, 'params').carId)));
  });
  return router;
}

/** Routes under /api/shops/:shopId/work-orders: the shop's board. */
export function shopWorkOrderRoutes(ds: DataSource) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  router.get('/', validate({ params: idParam('shopId'), query: workOrderListQuerySchema }), async (req, res) => {
    const { shopId } = parsed<{ shopId: string }>(res, 'params');
    const { status } = parsed<{ status?: WorkOrderStatus }>(res, 'query');
    res.json(list(await listShopWorkOrders(ds, currentUser(req), shopId, status)));
  });
  return router;
}

/** Routes under /api/work-orders. */
export function workOrderRoutes(ds: DataSource, mail?: MailSettings) {
  const router = Router();
  router.use(requireAuth);
  const params = idParam('workOrderId');
  const id = (res: { locals: Record<string, unknown> }) => parsed<{ workOrderId: string }>(res, 'params').workOrderId;

  router.get('/:workOrderId', validate({ params }), async (req, res) => {
    res.json(await getWorkOrder(ds, currentUser(req), id(res)));
  });
  router.patch('/:workOrderId', validate({ params, body: updateWorkOrderInputSchema }), async (req, res) => {
    res.json(await updateWorkOrder(ds, currentUser(req), id(res), parsed<UpdateWorkOrderInput>(res, 'body')));
  });
  router.put('/:workOrderId/lines', validate({ params, body: replaceLinesInputSchema }), async (req, res) => {
    res.json(await replaceLines(ds, currentUser(req), id(res), parsed<ReplaceLinesInput>(res, 'body')));
  });
  router.put(
    '/:workOrderId/measurements/:stage',
    validate({ params: z.strictObject({ workOrderId: z.uuid(), stage: stageSchema }), body: measurementsInputSchema }),
    async (req, res) => {
      const { workOrderId, stage } = parsed<{ workOrderId: string; stage: Stage }>(res, 'params');
      res.json(await putMeasurements(ds, currentUser(req), workOrderId, stage, parsed<MeasurementsInput>(res, 'body')));
    },
  );
  router.put('/:workOrderId/build-sheet', validate({ params, body: buildSheetInputSchema }), async (req, res) => {
    res.json(await putBuildSheet(ds, currentUser(req), id(res), parsed<BuildSheetInput>(res, 'body')));
  });
  router.post('/:workOrderId/close', validate({ params, body: closeWorkOrderInputSchema }), async (req, res) => {
    res.json(await closeWorkOrder(ds, mail, currentUser(req), id(res), parsed<CloseWorkOrderInput>(res, 'body')));
  });
  return router;
}
