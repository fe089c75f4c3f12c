import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { invoiceListQuerySchema, markPaidInputSchema, type InvoiceStatus } from '@shared/service/invoice.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import type { PaymentSettings } from '../payments/payment-settings';
import { createInvoice, getInvoice, getWorkOrderInvoice, listShopInvoices, markPaidInCash, startCheckout } from './invoice.service';

/** Routes under /api/work-orders/:workOrderId/invoice. */
export function workOrderInvoiceRoutes(ds: DataSource) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const workOrderParam = validate({ params: idParam('workOrderId') });

  router.post('/', workOrderParam, async (req, res) => {
    const { invoice, created } = await createInvoice(ds, currentUser(req), parsed<{ workOrderId: string }>(res, 'params').workOrderId);
    res.status(created ? 201 : 200).json(invoice);
  });
  router.get('/', workOrderParam, async (req, res) => {
    res.json(await getWorkOrderInvoice(ds, currentUser(req), parsed<{ workOrderId: string }>(res, 'params').workOrderId));
  });
  return router;
}

/** Routes under /api/invoices. */
export function invoiceRoutes(ds: DataSource, payments?: PaymentSettings) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const invoiceParam = validate({ params: idParam('invoiceId') });

  router.get('/:invoiceId', invoiceParam, async (req, res) => {
    res.json(await getInvoice(ds, currentUser(req), parsed<{ invoiceId: string }>(res, 'params').invoiceId));
  });
  router.post('/:invoiceId/checkout', invoiceParam, async (req, res) => {
    res.json(await startCheckout(ds, payments, currentUser(req), parsed<{ invoiceId: string }>(res, 'params').invoiceId));
  });
  router.post('/:invoiceId/mark-paid', validate({ params: idParam('invoiceId'), body: markPaidInputSchema }), async (req, res) => {
    res.json(await markPaidInCash(ds, payments, currentUser(req), parsed<{ invoiceId: string }>(res, 'params').invoiceId));
  });
  return router;
}

/** Routes under /api/shops/:shopId/invoices: the shop's invoice book. */
export function shopInvoiceRoutes(ds: DataSource) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  router.get('/', validate({ params: idParam('shopId'), query: invoiceListQuerySchema }), async (req, res) => {
    const { shopId } = parsed<{ shopId: string }>(res, 'params');
    const { status } = parsed<{ status?: InvoiceStatus }>(res, 'query');
    res.json(list(await listShopInvoices(ds, currentUser(req), shopId, status)));
  });
  return router;
}
