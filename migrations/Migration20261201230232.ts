import { Migration } from '@mikro-orm/migrations';

export class Migration20261201230232 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "order" add column "refunded_minor" int not null default 0;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "order" drop column "refunded_minor";`);
  }
}
