import { Migration } from '@mikro-orm/migrations';

export class Migration20261201231301 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `alter table "order_item" add column "prep_versions" jsonb not null default '[]', add column "proof_token_hash" varchar(64) null;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "order_item" drop column "prep_versions", drop column "proof_token_hash";`);
  }
}
