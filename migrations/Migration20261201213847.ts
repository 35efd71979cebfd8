import { Migration } from '@mikro-orm/migrations';

export class Migration20261201213847 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "blank_photo" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "blank_id" uuid not null, "key" varchar(300) not null, "width" int not null, "height" int not null, "sort_order" int not null, constraint "blank_photo_pkey" primary key ("id"));`,
    );

    this.addSql(
      `alter table "blank_photo" add constraint "blank_photo_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "blank_photo" add constraint "blank_photo_blank_id_foreign" foreign key ("blank_id") references "blank" ("id") on update cascade on delete cascade;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "blank_photo" cascade;`);
  }
}
