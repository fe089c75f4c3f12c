import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A person added as a co-driver of someone's car is told so (`co_driver_added`): nobody asks them first, so they
 * hear who added them, and can take themselves off the car if it is a mistake.
 */
export class CoDriverNotice1765584000000 implements MigrationInterface {
  name = 'CoDriverNotice1765584000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE notifications DROP CONSTRAINT notifications_kind_check`);
    await q.query(`
      ALTER TABLE notifications ADD CONSTRAINT notifications_kind_check
        CHECK (kind IN ('comment', 'suggestion', 'suggestion_decided', 'shop_grant', 'work_order_closed', 'invoice_paid', 'co_driver_added'))`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DELETE FROM notifications WHERE kind = 'co_driver_added'`);
    await q.query(`ALTER TABLE notifications DROP CONSTRAINT notifications_kind_check`);
    await q.query(`
      ALTER TABLE notifications ADD CONSTRAINT notifications_kind_check
        CHECK (kind IN ('comment', 'suggestion', 'suggestion_decided', 'shop_grant', 'work_order_closed', 'invoice_paid'))`);
  }
}
