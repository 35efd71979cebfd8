import { Migration } from '@mikro-orm/migrations';

export class Migration20261201224708 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `alter table "order_item" add column "replacement_token_hash" varchar(64) null, add column "replacement_reason" varchar(40) null, add column "replacement_note" text not null default '', add column "replacements" int not null default 0;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(
      `alter table "order_item" drop column "replacement_token_hash", drop column "replacement_reason", drop column "replacement_note", drop column "replacements";`,
    );
  }
}
