import { Migration } from '@mikro-orm/migrations';

export class Migration20261202002223 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "production_batch" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "number" int not null, "material_name" varchar(120) not null, "recipe_id" uuid null, "machine" jsonb null, "created_by" varchar(120) not null, constraint "production_batch_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "production_batch" add constraint "production_batch_studio_id_number_unique" unique ("studio_id", "number");`);

    this.addSql(
      `create table "render" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "item_id" uuid not null, "batch_id" uuid not null, "status" text check ("status" in ('queued', 'running', 'done', 'failed')) not null, "progress" int not null default 0, "step" varchar(80) not null default 'Waiting for a worker', "attempts" int not null default 0, "error" text null, "key_prefix" varchar(200) not null, "prep_version" int not null, "files" jsonb null, "started_at" timestamptz null, "finished_at" timestamptz null, constraint "render_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "render" add constraint "render_item_id_unique" unique ("item_id");`);

    this.addSql(
      `alter table "production_batch" add constraint "production_batch_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "render" add constraint "render_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "render" add constraint "render_item_id_foreign" foreign key ("item_id") references "order_item" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "render" add constraint "render_batch_id_foreign" foreign key ("batch_id") references "production_batch" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(`alter table "order_item" add column "handover" jsonb null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "render" drop constraint "render_batch_id_foreign";`);

    this.addSql(`drop table if exists "production_batch" cascade;`);

    this.addSql(`drop table if exists "render" cascade;`);

    this.addSql(`alter table "order_item" drop column "handover";`);
  }
}
