import { Migration } from '@mikro-orm/migrations';

export class Migration20261202025704 extends Migration {
  override async up(): Promise<void> {
    // The sign-in counters now hold every rate limit: renamed, so running counts carry over.
    this.addSql(`alter table "sign_in_limit" rename to "rate_limit";`);
    this.addSql(`alter table "rate_limit" rename constraint "sign_in_limit_pkey" to "rate_limit_pkey";`);

    this.addSql(
      `create table "audit_entry" ("id" uuid not null, "studio_id" uuid not null, "created_at" timestamptz not null default now(), "actor_id" uuid null, "actor_name" varchar(200) not null, "action" varchar(40) not null, "subject" varchar(200) not null, "summary" text not null, "link" varchar(300) null, "details" jsonb null, constraint "audit_entry_pkey" primary key ("id"));`,
    );
    this.addSql(`create index "audit_entry_studio_id_created_at_id_index" on "audit_entry" ("studio_id", "created_at", "id");`);

    this.addSql(
      `alter table "audit_entry" add constraint "audit_entry_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "audit_entry" add constraint "audit_entry_actor_id_foreign" foreign key ("actor_id") references "app_user" ("id") on update cascade on delete set null;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "rate_limit" rename constraint "rate_limit_pkey" to "sign_in_limit_pkey";`);
    this.addSql(`alter table "rate_limit" rename to "sign_in_limit";`);

    this.addSql(`drop table if exists "audit_entry" cascade;`);
  }
}
