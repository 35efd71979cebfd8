import { Migration } from '@mikro-orm/migrations';

export class Migration20261202005233 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "order_item" add column "position" int not null default 0;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "order_item" drop column "position";`);
  }
}
