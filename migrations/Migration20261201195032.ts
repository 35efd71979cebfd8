import { Migration } from '@mikro-orm/migrations';

export class Migration20261201195032 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "app_user" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "email" varchar(254) not null, "name" varchar(120) null, "password_hash" varchar(200) null, "email_verified_at" timestamptz null, "is_platform_admin" boolean not null default false, "session_version" int not null default 1, constraint "app_user_pkey" primary key ("id"));`,
    );
    this.addSql(`create unique index "app_user_email_lower_unique" on "app_user" (lower("email"));`);

    this.addSql(
      `create table "membership" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "user_id" uuid not null, "role" text check ("role" in ('owner', 'staff')) not null, constraint "membership_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "membership" add constraint "membership_studio_id_user_id_unique" unique ("studio_id", "user_id");`);

    this.addSql(
      `create table "invite" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "email" varchar(254) not null, "role" text check ("role" in ('owner', 'staff')) not null, "token_hash" varchar(64) not null, "expires_at" timestamptz not null, "used_at" timestamptz null, "revoked_at" timestamptz null, "invited_by_id" uuid null, constraint "invite_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "invite" add constraint "invite_token_hash_unique" unique ("token_hash");`);

    this.addSql(
      `create table "verification_token" ("identifier" varchar(300) not null, "token" varchar(128) not null, "expires" timestamptz not null, constraint "verification_token_pkey" primary key ("identifier", "token"));`,
    );

    this.addSql(
      `alter table "membership" add constraint "membership_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "membership" add constraint "membership_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "invite" add constraint "invite_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "invite" add constraint "invite_invited_by_id_foreign" foreign key ("invited_by_id") references "app_user" ("id") on update cascade on delete set null;`,
    );

    // Sign-in limits, in the shape the rate limiter library reads and writes.
    this.addSql(`create table "sign_in_limit" ("key" varchar(255) primary key, "points" integer not null default 0, "expire" bigint);`);

    this.addSql(
      `alter table "studio" add column "logo_key" varchar(300) null, add column "currency" varchar(3) not null default 'USD', add column "units" text check ("units" in ('in', 'mm')) not null default 'in', add column "contact_email" varchar(254) null;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "membership" drop constraint "membership_user_id_foreign";`);

    this.addSql(`alter table "invite" drop constraint "invite_invited_by_id_foreign";`);

    this.addSql(`drop table if exists "app_user" cascade;`);

    this.addSql(`drop table if exists "membership" cascade;`);

    this.addSql(`drop table if exists "invite" cascade;`);

    this.addSql(`drop table if exists "verification_token" cascade;`);

    this.addSql(`drop table if exists "sign_in_limit";`);

    this.addSql(`alter table "studio" drop column "logo_key", drop column "currency", drop column "units", drop column "contact_email";`);
  }
}
