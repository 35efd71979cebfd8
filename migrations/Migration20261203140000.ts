import { Migration } from '@mikro-orm/migrations';

export class Migration20261203140000 extends Migration {
  override async up(): Promise<void> {
    // E-mails to buyers go out in the studio's name and answer to the studio's contact address.
    this.addSql(`alter table "outbox_email" add column "from_name" varchar(120) null, add column "reply_to" varchar(254) null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "outbox_email" drop column "from_name", drop column "reply_to";`);
  }
}
