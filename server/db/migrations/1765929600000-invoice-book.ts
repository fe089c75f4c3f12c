import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A shop's invoices are its records: they outlive the visit, the car and the driver's account. Each invoice keeps
 * its own copy of the lines it billed and the visit's date and requested work, and loses only its links to the work
 * order and the car when those are deleted. Existing invoices copy their visit's lines and words now (a closed visit's
 * lines no longer change, so the copy is what was billed).
 */
export class InvoiceBook1765929600000 implements MigrationInterface {
  name = 'InvoiceBook1765929600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE invoice_lines (
        invoice_id uuid NOT NULL REFERENCES invoices(id) ON DELETE CASCADE,
        position integer NOT NULL,
        kind text NOT NULL CHECK (kind IN ('part', 'labour')),
        description text NOT NULL,
        quantity numeric(10, 2) NOT NULL,
        unit_price_cents integer NOT NULL,
        used_up boolean NOT NULL,
        amount_cents integer NOT NULL,
        PRIMARY KEY (invoice_id, position)
      )`);
    // numeric round() takes halves away from zero, as the invoice's own arithmetic does.
    await q.query(`
      INSERT INTO invoice_lines (invoice_id, position, kind, description, quantity, unit_price_cents, used_up, amount_cents)
      SELECT i.id, row_number() OVER (PARTITION BY i.id ORDER BY l.position, l.id) - 1, l.kind, l.description, l.quantity,
             l.unit_price_cents, l.used_up, round(l.quantity * l.unit_price_cents)
        FROM invoices i JOIN work_order_lines l ON l.work_order_id = i.work_order_id`);
    await q.query(`ALTER TABLE invoices ADD COLUMN visit_date date, ADD COLUMN requested_work text`);
    await q.query(`UPDATE invoices i SET visit_date = w.visit_date, requested_work = w.requested_work FROM work_orders w WHERE w.id = i.work_order_id`);
    await q.query(`
      ALTER TABLE invoices
        ALTER COLUMN visit_date SET NOT NULL,
        ALTER COLUMN requested_work SET NOT NULL,
        ALTER COLUMN work_order_id DROP NOT NULL,
        ALTER COLUMN car_id DROP NOT NULL,
        DROP CONSTRAINT invoices_work_order_id_fkey,
        DROP CONSTRAINT invoices_car_id_fkey,
        ADD CONSTRAINT invoices_work_order_id_fkey FOREIGN KEY (work_order_id) REFERENCES work_orders(id) ON DELETE SET NULL,
        ADD CONSTRAINT invoices_car_id_fkey FOREIGN KEY (car_id) REFERENCES cars(id) ON DELETE SET NULL`);
    await q.query(`CREATE INDEX invoices_shop_number_idx ON invoices (shop_id, status, number DESC)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX invoices_shop_number_idx`);
    await q.query(`DELETE FROM invoices WHERE work_order_id IS NULL OR car_id IS NULL`);
    await q.query(`
      ALTER TABLE invoices
        DROP CONSTRAINT invoices_car_id_fkey,
        DROP CONSTRAINT invoices_work_order_id_fkey,
        ADD CONSTRAINT invoices_car_id_fkey FOREIGN KEY (car_id) REFERENCES cars(id) ON DELETE CASCADE,
        ADD CONSTRAINT invoices_work_order_id_fkey FOREIGN KEY (work_order_id) REFERENCES work_orders(id) ON DELETE CASCADE,
        ALTER COLUMN car_id SET NOT NULL,
        ALTER COLUMN work_order_id SET NOT NULL,
        DROP COLUMN requested_work,
        DROP COLUMN visit_date`);
    await q.query(`DROP TABLE invoice_lines`);
  }
}
