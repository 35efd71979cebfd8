import { Migration } from '@mikro-orm/migrations';

export class Migration20261201192002 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "studio" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "slug" varchar(40) not null, "name" varchar(120) not null, "accent_colour" varchar(7) not null default '#b4532a', "status" text check ("status" in ('active', 'suspended')) not null default 'active', constraint "studio_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "studio" add constraint "studio_slug_unique" unique ("slug");`);
  }
}
