import { Migration } from '@mikro-orm/migrations';

export class Migration20261203131000 extends Migration {
  override async up(): Promise<void> {
    // The buyer's receipt is written at checkout, with the order's private link in it, and held
    // until the payment arrives; an order that is never paid takes its held receipt with it.
    this.addSql(`alter table "outbox_email" drop constraint if exists "outbox_email_status_check";`);
    this.addSql(
      `alter table "outbox_email" add constraint "outbox_email_status_check" check ("status" in ('held', 'pending', 'sent', 'failed'));`,
    );
    this.addSql(`alter table "outbox_email" add column "held_for_order_id" uuid null;`);
    this.addSql(`create index "outbox_email_held_for_order_id_index" on "outbox_email" ("held_for_order_id");`);
  }

  override async down(): Promise<void> {
    this.addSql(`delete from "outbox_email" where "status" = 'held';`);
    this.addSql(`drop index "outbox_email_held_for_order_id_index";`);
    this.addSql(`alter table "outbox_email" drop column "held_for_order_id";`);
    this.addSql(`alter table "outbox_email" drop constraint if exists "outbox_email_status_check";`);
    this.addSql(`alter table "outbox_email" add constraint "outbox_email_status_check" check ("status" in ('pending', 'sent', 'failed'));`);
  }
}
