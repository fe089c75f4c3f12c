import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * An invoice is a document a shop keeps and a driver files: it gets the shop's next number (1, 2, 3 … per shop,
 * with no gaps, the order invoices were made in), and it keeps who issued it, to whom and for which car as they
 * stood when it was made, so a shop that moves or a car renamed later does not change an issued invoice. The shop
 * writes the lines under its name itself (address, telephone, tax number), up to 500 characters.
 *
 * Invoices made before this are numbered in the order they were made and take the shop, owner and car as they are now.
 */
export class InvoiceNumbers1765843200000 implements MigrationInterface {
  name = 'InvoiceNumbers1765843200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE shops ADD COLUMN invoice_details text NOT NULL DEFAULT '' CHECK (length(invoice_details) <= 500)`);
    await q.query(`
      ALTER TABLE invoices
        ADD COLUMN number integer,
        ADD COLUMN issuer_name text,
        ADD COLUMN issuer_details text,
        ADD COLUMN bill_to text,
        ADD COLUMN car_name text,
        ADD COLUMN car_number text,
        ADD COLUMN car_class_code text`);
    await q.query(`
      UPDATE invoices i
         SET number = n.number, issuer_name = s.name, issuer_details = s.invoice_details, bill_to = u.display_name,
             car_name = c.name, car_number = c.car_number, car_class_code = c.class_code
        FROM (SELECT id, row_number() OVER (PARTITION BY shop_id ORDER BY created_at, id) AS number FROM invoices) n,
             shops s, cars c JOIN users u ON u.id = c.owner_id
       WHERE n.id = i.id AND s.id = i.shop_id AND c.id = i.car_id`);
    await q.query(`
      ALTER TABLE invoices
        ALTER COLUMN number SET NOT NULL,
        ALTER COLUMN issuer_name SET NOT NULL,
        ALTER COLUMN issuer_details SET NOT NULL,
        ALTER COLUMN bill_to SET NOT NULL,
        ALTER COLUMN car_name SET NOT NULL,
        ALTER COLUMN car_class_code SET NOT NULL,
        ADD CONSTRAINT invoices_number_check CHECK (number >= 1),
        ADD CONSTRAINT invoices_shop_number_key UNIQUE (shop_id, number)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE invoices
        DROP CONSTRAINT invoices_shop_number_key, DROP CONSTRAINT invoices_number_check,
        DROP COLUMN car_class_code, DROP COLUMN car_number, DROP COLUMN car_name, DROP COLUMN bill_to, DROP COLUMN issuer_details, DROP COLUMN issuer_name, DROP COLUMN number`);
    await q.query(`ALTER TABLE shops DROP COLUMN invoice_details`);
  }
}
