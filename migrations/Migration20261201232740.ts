import { Migration } from '@mikro-orm/migrations';

export class Migration20261201232740 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "studio" add column "proofs_required" boolean not null default true;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "studio" drop column "proofs_required";`);
  }
}
