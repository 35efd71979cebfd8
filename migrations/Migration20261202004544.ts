import { Migration } from '@mikro-orm/migrations';

export class Migration20261202004544 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "order_item" add column "proof_image_key" varchar(300) null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "order_item" drop column "proof_image_key";`);
  }
}
