import { Migration } from '@mikro-orm/migrations';

export class Migration20261203130000 extends Migration {
  override async up(): Promise<void> {
    // Orders are numbered from 1 unless the owner chooses another first number; a studio that has
    // taken no order yet starts from 1 too.
    this.addSql(`alter table "studio" alter column "next_order_number" set default 1;`);
    this.addSql(
      `update "studio" set "next_order_number" = 1 where "next_order_number" = 1001 and not exists (select 1 from "order" where "order"."studio_id" = "studio"."id");`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "studio" alter column "next_order_number" set default 1001;`);
  }
}
