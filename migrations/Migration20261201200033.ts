import { Migration } from '@mikro-orm/migrations';

export class Migration20261201200033 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "outbox_email" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "to" varchar(254) not null, "subject" varchar(300) not null, "text" text not null, "html" text null, "status" text check ("status" in ('pending', 'sent', 'failed')) not null default 'pending', "attempts" int not null default 0, "next_attempt_at" timestamptz not null default now(), "last_error" text null, "sent_at" timestamptz null, constraint "outbox_email_pkey" primary key ("id"));`,
    );
    this.addSql(`create index "outbox_email_status_next_attempt_at_index" on "outbox_email" ("status", "next_attempt_at");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "outbox_email" cascade;`);
  }
}
