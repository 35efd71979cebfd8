import { Migration } from '@mikro-orm/migrations';

export class Migration20261203074038 extends Migration {
  override async up(): Promise<void> {
    // The grayscale master's resolution, per studio: 1000 ppi unless the owner chooses the recipe's.
    this.addSql(
      `alter table "studio" add column "master_resolution" text check ("master_resolution" in ('1000-ppi', 'recipe')) not null default '1000-ppi';`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "studio" drop column "master_resolution";`);
  }
}
