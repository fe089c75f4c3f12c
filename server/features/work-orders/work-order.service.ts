import type { DataSource, EntityManager } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import { CORNERS, type Corner } from '@shared/season/corners';
import type { CreateSetupInput, SetupCorner } from '@shared/season/setup.schema';
import { handoverLabel } from '@shared/service/handover-label';
import {
  BUILD_SHEET_FIELDS, MEASUREMENT_FIELDS,
  type BuildSheetCorner, type BuildSheetInput, type CarWorkOrderSummary, type CloseWorkOrderInput, type CreateWorkOrderInput, type InvoiceStanding,
  type MeasuredCorner, type MeasurementsInput, type ReplaceLinesInput, type ShopWorkOrderRow, type Stage, type StageDiff,
  type UpdateWorkOrderInput, type WorkOrder, type WorkOrderStage, type WorkOrderStatus,
} from '@shared/service/work-order.schema';
import type { InvoiceStatus } from '@shared/service/invoice.schema';
import { balanceIfComplete, buildSheetChecks } from '@shared/calc/build-sheet.calc';
import { invoiceLineCents, roundedTaxRate } from '@shared/calc/invoice.calc';
import { AppError, staleVersion } from '../../lib/app-error';
import { assertCarAccess, assertShopAccess, assertWorkOrderAccess, carRelations, grantedShopOf, type Queryable } from '../../auth/access';
import type { MailSettings } from '../../mail/mailer';
import { activeSetupAt, checkSnapshotCorners, FIELD_WORDS, insertSnapshot } from '../setups/setup.service';
import { carAudience, driverRecipients, notify, sendOutbox } from '../notifications/notify';


const toSnake = (s: string) => s.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());
/** `date` columns are selected as `::text` ('YYYY-MM-DD'), so no time zone can shift them. */
const dateOnly = (d: Date | string) => String(d).slice(0, 10);

interface WorkOrderRow {
  id: string;
  shop_id: string;
  shop_name: string;
  shop_currency: string;
  shop_tax_rate_pct: number;
  tolerance_mm: number;
  car_id: string;
  car_name: string;
  front_motion_ratio: number | null;
  rear_motion_ratio: number | null;
  opened_by: string;
  opened_by_name: string;
  visit_date: string | Date;
  requested_work: string;
  notes: string | null;
  status: WorkOrderStatus;
  handover_at: Date | null;
  closed_by: string | null;
  closed_by_name: string | null;
  setup_id: string | null;
  version: number;
  created_at: Date;
  updated_at: Date;
}

async function loadRow(db: Queryable, workOrderId: string): Promise<WorkOrderRow> {
  const rows: WorkOrderRow[] = await db.query(
    `SELECT w.*, w.visit_date::text AS visit_date, s.name AS shop_name, s.compressed_length_tolerance_mm AS tolerance_mm, s.currency AS shop_currency, s.tax_rate_pct AS shop_tax_rate_pct,
            c.name AS car_name, c.front_motion_ratio, c.rear_motion_ratio,
            o.display_name AS opened_by_name, k.display_name AS closed_by_name
       FROM work_orders w JOIN shops s ON s.id = w.shop_id JOIN cars c ON c.id = w.car_id
       JOIN users o ON o.id = w.opened_by LEFT JOIN users k ON k.id = w.closed_by
      WHERE w.id = $1`,
    [workOrderId],
  );
  if (!rows[0]) throw new AppError('not_found', 'That work order was not found.');
  return rows[0];
}

const emptyMeasured = (): MeasuredCorner => Object.fromEntries(MEASUREMENT_FIELDS.map((f) => [f, null])) as MeasuredCorner;

/** The whole visit, with the balance, the before→after diff and the build-sheet checks worked out. */
export async function loadWorkOrder(db: Queryable, workOrderId: string): Promise<WorkOrder> {
  const w = await loadRow(db, workOrderId);
  const lines: { kind: 'part' | 'labour'; description: string; quantity: string; unit_price_cents: number; used_up: boolean }[] = await db.query(
    'SELECT kind, description, quantity, unit_price_cents, used_up FROM work_order_lines WHERE work_order_id = $1 ORDER BY position',
    [workOrderId],
  );
  const stageRows: { stage: Stage; measured_at: Date | null; driver_in_car: boolean; driver_weight_kg: number | null; fuel_level_pct: number | null }[] =
    await db.query('SELECT * FROM work_order_stages WHERE work_order_id = $1', [workOrderId]);
  const measured: ({ stage: Stage; corner: Corner } & Record<string, number | null>)[] = await db.query(
    'SELECT * FROM work_order_measurements WHERE work_order_id = $1',
    [workOrderId],
  );
  const sheetRows: ({ corner: Corner } & Record<string, unknown>)[] = await db.query('SELECT * FROM build_sheet_corners WHERE work_order_id = $1', [workOrderId]);

  const stages = { before: null, after: null } as Record<Stage, WorkOrderStage | null>;
  for (const s of stageRows) {
    const corners = Object.fromEntries(CORNERS.map((c) => [c, emptyMeasured()])) as Record<Corner, MeasuredCorner>;
    for (const m of measured.filter((x) => x.stage === s.stage)) {
      corners[m.corner] = Object.fromEntries(MEASUREMENT_FIELDS.map((f) => [f, m[toSnake(f)] ?? null])) as MeasuredCorner;
    }
    const b = balanceIfComplete(Object.fromEntries(CORNERS.map((c) => [c, corners[c].cornerWeightKg])));
    stages[s.stage] = {
      measuredAt: iso(s.measured_at),
      driverInCar: s.driver_in_car,
      driverWeightKg: s.driver_weight_kg,
      fuelLevelPct: s.fuel_level_pct,
      corners,
      balance: b ? { totalKg: b.totalKg, crossPct: b.crossPct, frontPct: b.frontPct, leftPct: b.leftPct } : null,
    };
  }
  const diff = Object.fromEntries(
    CORNERS.map((c) => [
      c,
      Object.fromEntries(
        MEASUREMENT_FIELDS.map((f) => {
          const a = stages.before?.corners[c][f];
          const z = stages.after?.corners[c][f];
          return [f, a === null || a === undefined || z === null || z === undefined ? null : Number((z - a).toFixed(6))];
        }),
      ),
    ]),
  ) as StageDiff;

  const sheet = Object.fromEntries(CORNERS.map((c) => [c, null])) as Record<Corner, BuildSheetCorner | null>;
  for (const r of sheetRows) sheet[r.corner] = Object.fromEntries(BUILD_SHEET_FIELDS.map((f) => [f, r[toSnake(f)] ?? null])) as BuildSheetCorner;
  const motionRatio = { front: w.front_motion_ratio, rear: w.rear_motion_ratio };

  const outLines = lines.map((l) => {
    const quantity = Number(l.quantity);
    return {
      kind: l.kind,
      description: l.description,
      quantity,
      unitPriceCents: l.unit_price_cents,
      usedUp: l.used_up,
      totalCents: invoiceLineCents({ quantity, unitPriceCents: l.unit_price_cents }),
    };
  });
  const sum = (kind: string) => outLines.filter((l) => l.kind === kind).reduce((a, l) => a + l.totalCents, 0);
  return {
    id: w.id,
    carId: w.car_id,
    carName: w.car_name,
    shop: { id: w.shop_id, name: w.shop_name, compressedLengthToleranceMm: w.tolerance_mm, currency: w.shop_currency, taxRatePct: roundedTaxRate(Number(w.shop_tax_rate_pct)) },
    openedBy: { id: w.opened_by, displayName: w.opened_by_name },
    visitDate: dateOnly(w.visit_date),
    requestedWork: w.requested_work,
    notes: w.notes,
    status: w.status,
    handoverAt: iso(w.handover_at),
    closedBy: w.closed_by ? { id: w.closed_by, displayName: w.closed_by_name ?? '' } : null,
    setupId: w.setup_id,
    lines: outLines,
    totals: { partsCents: sum('part'), labourCents: sum('labour'), subtotalCents: sum('part') + sum('labour') },
    stages,
    diff,
    buildSheet: {
      motionRatio,
      corners: sheet,
      checks: buildSheetChecks({ corners: sheet, motionRatio, toleranceMm: w.tolerance_mm }),
    },
    version: w.version,
    createdAt: iso(w.created_at)!,
    updatedAt: iso(w.updated_at)!,
  };
}

/* ---------- Open, list, read ---------- */

export async function createWorkOrder(ds: DataSource, user: User, carId: string, input: CreateWorkOrderInput): Promise<{ workOrder: WorkOrder; created: boolean }> {
  await assertCarAccess(ds, user, carId, 'service');
  let shopId: string;
  if (input.shopId) {
    const rows = await ds.query(
      `SELECT 1 FROM shop_grants g JOIN shop_members m ON m.shop_id = g.shop_id AND m.user_id = $3 WHERE g.car_id = $1 AND g.shop_id = $2`,
      [carId, input.shopId, user.id],
    );
    if (rows.length === 0) throw new AppError('validation_failed', 'Some fields need attention.', { shopId: ['Pick one of your shops that this car is shared with'] });
    shopId = input.shopId;
  } else {
    shopId = (await grantedShopOf(ds, user.id, carId))!.id;
  }
  const values = [input.id ?? null, shopId, carId, user.id, input.visitDate, input.requestedWork, input.notes ?? null];
  const inserted: { id: string }[] = await ds.query(
    `INSERT INTO work_orders (id, shop_id, car_id, opened_by, visit_date, requested_work, notes)
     VALUES (COALESCE($1::uuid, gen_random_uuid()), $2, $3, $4, $5, $6, $7)
     ON CONFLICT (id) DO NOTHING RETURNING id`,
    values,
  );
  if (inserted[0]) return { workOrder: await loadWorkOrder(ds, inserted[0].id), created: true };
  // A replayed client id: the stored visit, if it is this car's and this user may see it.
  const existing: { car_id: string }[] = await ds.query('SELECT car_id FROM work_orders WHERE id = $1', [input.id]);
  if (existing[0]?.car_id !== carId) throw new AppError('conflict', 'That work order id is already in use.');
  await assertWorkOrderAccess(ds, user, input.id!, 'read');
  return { workOrder: await loadWorkOrder(ds, input.id!), created: false };
}

/** A visit's invoice as the lists show it, from `invoices i` joined on the visit. */
const INVOICE_STANDING_COLUMNS = 'i.number AS invoice_number, i.status AS invoice_status, i.total_cents AS invoice_total_cents, i.currency AS invoice_currency';
interface InvoiceStandingRow {
  invoice_number: number | null;
  invoice_status: InvoiceStatus | null;
  invoice_total_cents: number | null;
  invoice_currency: string | null;
}
const invoiceStanding = (r: InvoiceStandingRow): InvoiceStanding | null =>
  r.invoice_number === null
    ? null
    : { number: r.invoice_number, status: r.invoice_status!, totalCents: r.invoice_total_cents!, currency: r.invoice_currency! };

/** The car's visits, oldest first: its drivers see every visit, shop staff their own shops' visits. */
export async function listCarWorkOrders(ds: DataSource, user: User, carId: string): Promise<CarWorkOrderSummary[]> {
  await assertCarAccess(ds, user, carId, 'read');
  const relations = await carRelations(ds, user.id, carId);
  const drives = relations.includes('owner') || relations.includes('co_driver');
  const rows: ({ id: string; shop_id: string; shop_name: string; visit_date: string | Date; requested_work: string; status: WorkOrderStatus; handover_at: Date | null; setup_id: string | null } & InvoiceStandingRow)[] =
    await ds.query(
      `SELECT w.id, w.shop_id, s.name AS shop_name, w.visit_date::text AS visit_date, w.requested_work, w.status, w.handover_at, w.setup_id,
              ${INVOICE_STANDING_COLUMNS}
         FROM work_orders w JOIN shops s ON s.id = w.shop_id LEFT JOIN invoices i ON i.work_order_id = w.id
        WHERE w.car_id = $1 AND ($3 OR EXISTS (SELECT 1 FROM shop_members m WHERE m.shop_id = w.shop_id AND m.user_id = $2))
        ORDER BY w.visit_date, w.created_at`,
      [carId, user.id, drives],
    );
  return rows.map((r) => ({
    id: r.id,
    shop: { id: r.shop_id, name: r.shop_name },
    visitDate: dateOnly(r.visit_date),
    requestedWork: r.requested_work,
    status: r.status,
    handoverAt: iso(r.handover_at),
    setupId: r.setup_id,
    invoice: invoiceStanding(r),
  }));
}

/** The shop's board: open visits (or closed, or all), newest visit first. */
export async function listShopWorkOrders(ds: DataSource, user: User, shopId: string, status?: WorkOrderStatus): Promise<ShopWorkOrderRow[]> {
  await assertShopAccess(ds, user, shopId, 'read');
  const rows: ({ id: string; car_id: string; car_name: string; owner_id: string; owner_name: string; visit_date: string | Date; requested_work: string; status: WorkOrderStatus; handover_at: Date | null } & InvoiceStandingRow)[] =
    await ds.query(
      `SELECT w.id, w.car_id, c.name AS car_name, c.owner_id, u.display_name AS owner_name, w.visit_date::text AS visit_date, w.requested_work, w.status, w.handover_at,
              ${INVOICE_STANDING_COLUMNS}
         FROM work_orders w JOIN cars c ON c.id = w.car_id JOIN users u ON u.id = c.owner_id LEFT JOIN invoices i ON i.work_order_id = w.id
        WHERE w.shop_id = $1 AND ($2::text IS NULL OR w.status = $2)
        ORDER BY w.visit_date DESC, w.created_at DESC`,
      [shopId, status ?? null],
    );
  return rows.map((r) => ({
    id: r.id,
    car: { id: r.car_id, name: r.car_name },
    owner: { id: r.owner_id, displayName: r.owner_name },
    visitDate: dateOnly(r.visit_date),
    requestedWork: r.requested_work,
    status: r.status,
    handoverAt: iso(r.handover_at),
    invoice: invoiceStanding(r),
  }));
}

export async function getWorkOrder(ds: DataSource, user: User, workOrderId: string): Promise<WorkOrder> {
  await assertWorkOrderAccess(ds, user, workOrderId, 'read');
  return loadWorkOrder(ds, workOrderId);
}

/* ---------- Edits (open visits only) ---------- */

/** Thrown inside an edit's transaction to roll it back when the version sent is not the stored one. */
class StaleSignal extends Error {}

/**
 * Checks the user may edit, then runs `write` in one transaction with the visit's row
 * locked and still open; bumps the version.
 */
async function editOpen<T>(ds: DataSource, user: User, workOrderId: string, write: (m: EntityManager, w: WorkOrderRow) => Promise<T>): Promise<T> {
  await assertWorkOrderAccess(ds, user, workOrderId, 'edit');
  return ds.transaction(async (m) => {
    await m.query('SELECT 1 FROM work_orders WHERE id = $1 FOR UPDATE', [workOrderId]);
    const w = await loadRow(m, workOrderId);
    if (w.status !== 'open') throw new AppError('conflict', 'This work order is closed; it can no longer be changed.');
    const result = await write(m, w);
    await m.query('UPDATE work_orders SET version = version + 1, updated_at = now() WHERE id = $1', [workOrderId]);
    return result;
  });
}

export async function updateWorkOrder(ds: DataSource, user: User, workOrderId: string, input: UpdateWorkOrderInput): Promise<WorkOrder> {
  const fresh = await editOpen(ds, user, workOrderId, async (m, w) => {
    if (w.version !== input.version) throw new StaleSignal();
    await m.query(
      `UPDATE work_orders SET visit_date = COALESCE($2, visit_date), requested_work = COALESCE($3, requested_work),
              notes = CASE WHEN $4 THEN $5 ELSE notes END
        WHERE id = $1`,
      [workOrderId, input.visitDate ?? null, input.requestedWork ?? null, input.notes !== undefined, input.notes ?? null],
    );
    return true;
  }).catch((err: unknown) => {
    if (err instanceof StaleSignal) return false;
    throw err;
  });
  if (!fresh) throw staleVersion(await loadWorkOrder(ds, workOrderId));
  return loadWorkOrder(ds, workOrderId);
}

export async function replaceLines(ds: DataSource, user: User, workOrderId: string, input: ReplaceLinesInput): Promise<WorkOrder> {
  await editOpen(ds, user, workOrderId, async (m) => {
    await m.query('DELETE FROM work_order_lines WHERE work_order_id = $1', [workOrderId]);
    for (const [position, l] of input.lines.entries()) {
      await m.query(
        'INSERT INTO work_order_lines (work_order_id, kind, description, quantity, unit_price_cents, used_up, position) VALUES ($1, $2, $3, $4, $5, $6, $7)',
        // The schema refuses a used-up labour line; left out, a part stays on the car.
        [workOrderId, l.kind, l.description, l.quantity, l.unitPriceCents, l.usedUp ?? false, position],
      );
    }
  });
  return loadWorkOrder(ds, workOrderId);
}

/** Replaces one stage: how the car sat, and every corner's readings (corners left out are cleared). */
export async function putMeasurements(ds: DataSource, user: User, workOrderId: string, stage: Stage, input: MeasurementsInput): Promise<WorkOrder> {
  await editOpen(ds, user, workOrderId, async (m) => {
    await m.query(
      `INSERT INTO work_order_stages (work_order_id, stage, measured_at, driver_in_car, driver_weight_kg, fuel_level_pct)
       VALUES ($1, $2, $3, $4, $5, $6)
       ON CONFLICT (work_order_id, stage) DO UPDATE SET measured_at = EXCLUDED.measured_at, driver_in_car = EXCLUDED.driver_in_car,
              driver_weight_kg = EXCLUDED.driver_weight_kg, fuel_level_pct = EXCLUDED.fuel_level_pct`,
      [workOrderId, stage, input.measuredAt ?? null, input.driverInCar, input.driverInCar ? input.driverWeightKg : (input.driverWeightKg ?? null), input.fuelLevelPct ?? null],
    );
    await m.query('DELETE FROM work_order_measurements WHERE work_order_id = $1 AND stage = $2', [workOrderId, stage]);
    for (const corner of CORNERS) {
      const c = input.corners[corner];
      if (!c) continue;
      await m.query(
        `INSERT INTO work_order_measurements (work_order_id, stage, corner, camber_deg, toe_mm, caster_deg, ride_height_mm, corner_weight_kg)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8)`,
        [workOrderId, stage, corner, c.camberDeg ?? null, c.toeMm ?? null, c.casterDeg ?? null, c.rideHeightMm ?? null, c.cornerWeightKg ?? null],
      );
    }
  });
  return loadWorkOrder(ds, workOrderId);
}

/** The corners given replace those corners of the sheet; the others stay. */
export async function putBuildSheet(ds: DataSource, user: User, workOrderId: string, input: BuildSheetInput): Promise<WorkOrder> {
  const columns = BUILD_SHEET_FIELDS.map(toSnake);
  await editOpen(ds, user, workOrderId, async (m) => {
    for (const corner of CORNERS) {
      const c = input.corners[corner];
      if (!c) continue;
      await m.query(
        `INSERT INTO build_sheet_corners (work_order_id, corner, ${columns.join(', ')})
         VALUES ($1, $2, ${columns.map((_, i) => `$${i + 3}`).join(', ')})
         ON CONFLICT (work_order_id, corner) DO UPDATE SET ${columns.map((col) => `${col} = EXCLUDED.${col}`).join(', ')}`,
        [workOrderId, corner, ...BUILD_SHEET_FIELDS.map((f) => c[f] ?? null)],
      );
    }
  });
  return loadWorkOrder(ds, workOrderId);
}

/* ---------- Handover ---------- */

const trimTo = (s: string, max: number) => (s.length <= max ? s : `${s.slice(0, max - 1).trimEnd()}…`);

/**
 * Closes the visit in one transaction: a new setup snapshot on the car (the one in force at
 * handover with the after-measurements and the build sheet's springs and clicks laid over it),
 * one change-log entry per part fitted (not for parts used up in the work, which are only billed), the visit marked
 * closed, and the drivers notified.
 * Existing snapshots and runs are never touched. E-mails go after the commit.
 */
export async function closeWorkOrder(
  ds: DataSource,
  mail: MailSettings | undefined,
  user: User,
  workOrderId: string,
  input: CloseWorkOrderInput,
): Promise<WorkOrder> {
  await assertWorkOrderAccess(ds, user, workOrderId, 'edit');
  const handoverAt = new Date(input.handoverAt);
  const outbox = await ds.transaction(async (m) => {
    await m.query('SELECT 1 FROM work_orders WHERE id = $1 FOR UPDATE', [workOrderId]);
    const w = await loadRow(m, workOrderId);
    if (w.status !== 'open') throw new AppError('conflict', 'This work order is already closed.');
    const visit = await loadWorkOrder(m, workOrderId);
    const base = await activeSetupAt(m, w.car_id, handoverAt);

    const corners = {} as Record<Corner, SetupCorner>;
    for (const corner of CORNERS) {
      const values: SetupCorner = { ...(base?.corners[corner] ?? {}) };
      const after = visit.stages.after?.corners[corner];
      for (const f of MEASUREMENT_FIELDS) {
        const v = after?.[f];
        if (v !== null && v !== undefined) values[f] = v;
      }
      const sheet = visit.buildSheet.corners[corner];
      if (sheet?.mainSpringRateNPerMm) values.springRateNPerMm = sheet.mainSpringRateNPerMm;
      if (sheet?.bumpClicks !== null && sheet?.bumpClicks !== undefined) values.damperClicks = sheet.bumpClicks;
      if (sheet?.reboundClicks !== null && sheet?.reboundClicks !== undefined) values.damperReboundClicks = sheet.reboundClicks;
      corners[corner] = values;
    }
    // What is handed over must be a setup the driver can work from: in range, clicks within the adjusters.
    await checkSnapshotCorners(m, w.car_id, corners).catch((err: unknown) => {
      if (!(err instanceof AppError) || !err.fieldErrors) throw err;
      const problems = Object.entries(err.fieldErrors).map(([key, messages]) => {
        const [, corner, field] = key.split('.');
        return `${corner!.toUpperCase()} ${FIELD_WORDS[field as keyof typeof FIELD_WORDS] ?? field}: ${messages.join('; ')}`;
      });
      throw new AppError(
        'validation_failed',
        `The setup this visit hands over would not be valid (${problems.join('. ')}). Correct the build sheet or the after measurements, then close it.`,
        err.fieldErrors,
      );
    });
    const snapshot: CreateSetupInput = {
      label: input.label ?? handoverLabel(w.shop_name, w.requested_work),
      effectiveFrom: handoverAt.toISOString(),
      corners,
      axles: {
        front: { antiRollBar: base?.axles.front.antiRollBar ?? null },
        rear: { antiRollBar: base?.axles.rear.antiRollBar ?? null },
      },
      derivedFromId: base?.id ?? null,
      notes: `Handed over by ${w.shop_name} after: ${trimTo(w.requested_work, 1900)}`,
    };
    const { id: setupId } = await insertSnapshot(m, user, w.car_id, snapshot);
    await m.query('UPDATE setup_snapshots SET work_order_id = $2 WHERE id = $1', [setupId, workOrderId]);

    // Only what stays on the car is a change to it: brake fluid or shop supplies used up in the work are billed, not fitted.
    for (const line of visit.lines.filter((l) => l.kind === 'part' && !l.usedUp)) {
      await m.query(
        `INSERT INTO change_log (car_id, changed_on, what, location, setup_id, created_by, work_order_id)
         VALUES ($1, $2, $3, 'car', $4, $5, $6)`,
        [w.car_id, visit.visitDate, trimTo(`Fitted: ${line.description} ×${line.quantity}`, 200), setupId, user.id, workOrderId],
      );
    }
    await m.query(
      `UPDATE work_orders SET status = 'closed', handover_at = $2, closed_by = $3, setup_id = $4, version = version + 1, updated_at = now()
        WHERE id = $1`,
      [workOrderId, handoverAt, user.id, setupId],
    );

    const audience = await carAudience(m, w.car_id);
    return notify(m, mail, {
      kind: 'work_order_closed',
      actorId: user.id,
      carId: w.car_id,
      workOrderId,
      summary: `${w.shop_name} finished "${trimTo(w.requested_work, 120)}" on ${w.car_name} and handed it over; a new setup was recorded from the after-measurements.`,
      detail: 'Open the handover sheet to see the before and after numbers, the parts fitted and the cautions.',
      recipients: driverRecipients(audience, `/cars/${w.car_id}`),
    });
  });
  sendOutbox(mail, outbox);
  return loadWorkOrder(ds, workOrderId);
}

/** Used by the comments feature: the visit's car and how a thread on it is described. */
export async function workOrderTarget(db: Queryable, workOrderId: string): Promise<{ carId: string; shopId: string; description: string } | null> {
  const rows: { car_id: string; shop_id: string; requested_work: string; shop_name: string }[] = await db.query(
    'SELECT w.car_id, w.shop_id, w.requested_work, s.name AS shop_name FROM work_orders w JOIN shops s ON s.id = w.shop_id WHERE w.id = $1',
    [workOrderId],
  );
  const r = rows[0];
  return r ? { carId: r.car_id, shopId: r.shop_id, description: `the ${r.shop_name} visit "${trimTo(r.requested_work, 60)}"` } : null;
}
