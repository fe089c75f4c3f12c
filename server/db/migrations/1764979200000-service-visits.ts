import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Shop service visits: work orders with parts and labour lines, before/after measurements
 * per corner, a coilover build sheet per corner, and invoices paid online or in cash.
 * Closing a work order writes a new setup snapshot and change-log entries; the links back
 * to the visit are kept on both.
 */
export class ServiceVisits1764979200000 implements MigrationInterface {
  name = 'ServiceVisits1764979200000';

  async up(q: QueryRunner): Promise<void> {
    // What each shop sets for its own bench: the tax rate on invoices, its currency, and how much
    // shorter than the reference a damper's compressed length may be before the build sheet warns.
    await q.query(`ALTER TABLE shops ADD COLUMN tax_rate_pct double precision NOT NULL DEFAULT 0 CHECK (tax_rate_pct >= 0 AND tax_rate_pct <= 50)`);
    await q.query(`ALTER TABLE shops ADD COLUMN currency text NOT NULL DEFAULT 'usd' CHECK (currency ~ '^[a-z]{3}$')`);
    await q.query(`ALTER TABLE shops ADD COLUMN compressed_length_tolerance_mm double precision NOT NULL DEFAULT 15 CHECK (compressed_length_tolerance_mm >= 0 AND compressed_length_tolerance_mm <= 100)`);

    await q.query(`
      CREATE TABLE work_orders (
        id uuid PRIMARY KEY,
        shop_id uuid NOT NULL REFERENCES shops(id) ON DELETE CASCADE,
        car_id uuid NOT NULL REFERENCES cars(id) ON DELETE CASCADE,
        opened_by uuid NOT NULL REFERENCES users(id),
        visit_date date NOT NULL,
        requested_work text NOT NULL CHECK (length(requested_work) BETWEEN 1 AND 2000),
        notes text,
        status text NOT NULL DEFAULT 'open' CHECK (status IN ('open', 'closed')),
        handover_at timestamptz,
        closed_by uuid REFERENCES users(id),
        setup_id uuid REFERENCES setup_snapshots(id) ON DELETE SET NULL,
        version integer NOT NULL DEFAULT 1,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT work_orders_closed_has_handover CHECK (status = 'open' OR handover_at IS NOT NULL)
      )`);
    await q.query(`CREATE INDEX work_orders_shop_idx ON work_orders (shop_id, status, visit_date DESC)`);
    await q.query(`CREATE INDEX work_orders_car_idx ON work_orders (car_id, visit_date)`);

    // Parts (quantity × unit price) and labour (hours × hourly rate); money in whole cents.
    await q.query(`
      CREATE TABLE work_order_lines (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        work_order_id uuid NOT NULL REFERENCES work_orders(id) ON DELETE CASCADE,
        kind text NOT NULL CHECK (kind IN ('part', 'labour')),
        description text NOT NULL CHECK (length(description) BETWEEN 1 AND 200),
        quantity numeric(10, 2) NOT NULL CHECK (quantity > 0),
        unit_price_cents integer NOT NULL CHECK (unit_price_cents >= 0),
        position integer NOT NULL
      )`);
    await q.query(`CREATE INDEX work_order_lines_order_idx ON work_order_lines (work_order_id, position)`);

    // How the car sat when it was measured, before and after the work.
    await q.query(`
      CREATE TABLE work_order_stages (
        work_order_id uuid NOT NULL REFERENCES work_orders(id) ON DELETE CASCADE,
        stage text NOT NULL CHECK (stage IN ('before', 'after')),
        measured_at timestamptz,
        driver_in_car boolean NOT NULL DEFAULT false,
        driver_weight_kg double precision CHECK (driver_weight_kg BETWEEN 20 AND 250),
        fuel_level_pct double precision CHECK (fuel_level_pct BETWEEN 0 AND 100),
        PRIMARY KEY (work_order_id, stage)
      )`);
    await q.query(`
      CREATE TABLE work_order_measurements (
        work_order_id uuid NOT NULL REFERENCES work_orders(id) ON DELETE CASCADE,
        stage text NOT NULL CHECK (stage IN ('before', 'after')),
        corner text NOT NULL CHECK (corner IN ('lf', 'rf', 'lr', 'rr')),
        camber_deg double precision,
        toe_mm double precision,
        caster_deg double precision,
        ride_height_mm double precision,
        corner_weight_kg double precision,
        PRIMARY KEY (work_order_id, stage, corner)
      )`);

    // A coilover build sheet, per corner, for dampers whose body length is adjustable.
    await q.query(`
      CREATE TABLE build_sheet_corners (
        work_order_id uuid NOT NULL REFERENCES work_orders(id) ON DELETE CASCADE,
        corner text NOT NULL CHECK (corner IN ('lf', 'rf', 'lr', 'rr')),
        damper_free_length_mm double precision,
        damper_compressed_length_mm double precision,
        reference_compressed_length_mm double precision,
        stroke_mm double precision,
        body_length_setting text,
        main_spring_rate_n_per_mm double precision,
        main_spring_free_length_mm double precision,
        helper_spring_rate_n_per_mm double precision,
        helper_spring_free_length_mm double precision,
        perch_position_mm double precision,
        preload_mm double precision,
        bump_clicks integer,
        rebound_clicks integer,
        wheel_load_kg double precision,
        wheel_droop_mm double precision,
        bump_stop_mm double precision,
        notes text,
        PRIMARY KEY (work_order_id, corner)
      )`);

    // Closing a visit logs the parts fitted; each entry keeps its visit.
    await q.query(`ALTER TABLE change_log ADD COLUMN work_order_id uuid REFERENCES work_orders(id) ON DELETE SET NULL`);
    await q.query(`ALTER TABLE setup_snapshots ADD COLUMN work_order_id uuid REFERENCES work_orders(id) ON DELETE SET NULL`);
    await q.query(`CREATE UNIQUE INDEX setup_snapshots_work_order_key ON setup_snapshots (work_order_id) WHERE work_order_id IS NOT NULL`);

    // Totals are worked out once, when the invoice is made, and kept as issued.
    await q.query(`
      CREATE TABLE invoices (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        work_order_id uuid NOT NULL UNIQUE REFERENCES work_orders(id) ON DELETE CASCADE,
        shop_id uuid NOT NULL REFERENCES shops(id) ON DELETE CASCADE,
        car_id uuid NOT NULL REFERENCES cars(id) ON DELETE CASCADE,
        currency text NOT NULL,
        subtotal_cents integer NOT NULL CHECK (subtotal_cents >= 0),
        tax_rate_pct double precision NOT NULL,
        tax_cents integer NOT NULL CHECK (tax_cents >= 0),
        total_cents integer NOT NULL CHECK (total_cents >= 0),
        status text NOT NULL DEFAULT 'open' CHECK (status IN ('open', 'paid')),
        paid_at timestamptz,
        paid_method text CHECK (paid_method IN ('card', 'cash')),
        checkout_session_id text UNIQUE,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT invoices_paid_has_method CHECK (status = 'open' OR (paid_at IS NOT NULL AND paid_method IS NOT NULL))
      )`);
    // Payment-service events already handled: a replayed event finds its id here and changes nothing.
    await q.query(`
      CREATE TABLE payment_events (
        id text PRIMARY KEY,
        type text NOT NULL,
        invoice_id uuid REFERENCES invoices(id) ON DELETE SET NULL,
        received_at timestamptz NOT NULL DEFAULT now()
      )`);

    await q.query(`ALTER TABLE notifications DROP CONSTRAINT notifications_kind_check`);
    await q.query(`
      ALTER TABLE notifications ADD CONSTRAINT notifications_kind_check
        CHECK (kind IN ('comment', 'suggestion', 'suggestion_decided', 'shop_grant', 'work_order_closed', 'invoice_paid'))`);
    await q.query(`ALTER TABLE notifications ADD COLUMN work_order_id uuid REFERENCES work_orders(id) ON DELETE CASCADE`);
    await q.query(`ALTER TABLE comments ADD COLUMN work_order_id uuid REFERENCES work_orders(id) ON DELETE CASCADE`);
    await q.query(`ALTER TABLE comments DROP CONSTRAINT comments_one_target`);
    await q.query(`ALTER TABLE comments ADD CONSTRAINT comments_one_target CHECK (num_nonnulls(run_id, event_id, setup_id, tread_reading_id, work_order_id) = 1)`);
    await q.query(`CREATE INDEX comments_work_order_idx ON comments (work_order_id, created_at) WHERE work_order_id IS NOT NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DELETE FROM comments WHERE work_order_id IS NOT NULL`);
    await q.query(`ALTER TABLE comments DROP CONSTRAINT comments_one_target`);
    await q.query(`ALTER TABLE comments ADD CONSTRAINT comments_one_target CHECK (num_nonnulls(run_id, event_id, setup_id, tread_reading_id) = 1)`);
    await q.query(`ALTER TABLE comments DROP COLUMN work_order_id`);
    await q.query(`DELETE FROM notifications WHERE kind IN ('work_order_closed', 'invoice_paid')`);
    await q.query(`ALTER TABLE notifications DROP COLUMN work_order_id`);
    await q.query(`ALTER TABLE notifications DROP CONSTRAINT notifications_kind_check`);
    await q.query(`ALTER TABLE notifications ADD CONSTRAINT notifications_kind_check CHECK (kind IN ('comment', 'suggestion', 'suggestion_decided', 'shop_grant'))`);
    await q.query(`ALTER TABLE setup_snapshots DROP COLUMN work_order_id`);
    await q.query(`ALTER TABLE change_log DROP COLUMN work_order_id`);
    for (const table of ['payment_events', 'invoices', 'build_sheet_corners', 'work_order_measurements', 'work_order_stages', 'work_order_lines', 'work_orders']) {
      await q.query(`DROP TABLE IF EXISTS ${table}`);
    }
    await q.query(`ALTER TABLE shops DROP COLUMN compressed_length_tolerance_mm, DROP COLUMN currency, DROP COLUMN tax_rate_pct`);
  }
}
