import { Migration } from '@mikro-orm/migrations';

export class Migration20261201220817 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "payment_event" ("id" varchar(120) not null, "type" varchar(80) not null, "processed_at" timestamptz not null default now(), constraint "payment_event_pkey" primary key ("id"));`,
    );

    this.addSql(
      `create table "shipping_rate" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "name" varchar(80) not null, "price_minor" int not null, "sort_order" int not null, constraint "shipping_rate_pkey" primary key ("id"));`,
    );

    this.addSql(
      `create table "order" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "number" int not null, "status" text check ("status" in ('awaiting_payment', 'paid', 'fulfilled', 'cancelled', 'refunded')) not null, "buyer_email" varchar(254) not null, "buyer_name" varchar(120) not null, "delivery_method" text check ("delivery_method" in ('ship', 'pickup')) not null, "shipping_address" jsonb null, "shipping_rate" jsonb null, "currency" varchar(3) not null, "subtotal_minor" int not null, "shipping_minor" int not null, "total_minor" int not null, "access_key_hash" varchar(64) not null, "checkout_session_id" varchar(120) null, "payment_intent_id" varchar(120) null, "paid_at" timestamptz null, "note" text null, constraint "order_pkey" primary key ("id"));`,
    );
    this.addSql(`create index "order_checkout_session_id_index" on "order" ("checkout_session_id");`);
    this.addSql(`alter table "order" add constraint "order_studio_id_number_unique" unique ("studio_id", "number");`);

    this.addSql(
      `create table "buyer_photo" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "original_key" varchar(300) not null, "preview_key" varchar(300) not null, "thumb_key" varchar(300) not null, "format" varchar(10) not null, "width" int not null, "height" int not null, "preview_width" int not null, "preview_height" int not null, "byte_size" int not null, "quality" jsonb not null, constraint "buyer_photo_pkey" primary key ("id"));`,
    );

    this.addSql(
      `create table "order_item" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "order_id" uuid not null, "stage" text check ("stage" in ('unpaid', 'photo_review', 'needs_new_photo', 'prep', 'proof_sent', 'changes_requested', 'approved', 'in_production', 'burned', 'shipped', 'picked_up', 'cancelled')) not null, "size_id" uuid null, "snapshot" jsonb not null, "quantity" int not null, "unit_price_minor" int not null, "photo_id" uuid not null, "placement" jsonb not null, "orientation" text check ("orientation" in ('portrait', 'landscape')) not null, "inscription" jsonb null, "effective_ppi" int not null, "low_resolution_confirmed" boolean not null, constraint "order_item_pkey" primary key ("id"));`,
    );

    this.addSql(
      `create table "order_event" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "order_id" uuid not null, "item_id" uuid null, "type" varchar(40) not null, "actor" varchar(120) not null, "text" text not null, constraint "order_event_pkey" primary key ("id"));`,
    );

    this.addSql(
      `alter table "shipping_rate" add constraint "shipping_rate_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "order" add constraint "order_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "buyer_photo" add constraint "buyer_photo_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "order_item" add constraint "order_item_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "order_item" add constraint "order_item_order_id_foreign" foreign key ("order_id") references "order" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "order_item" add constraint "order_item_size_id_foreign" foreign key ("size_id") references "blank_size" ("id") on update cascade on delete set null;`,
    );
    this.addSql(
      `alter table "order_item" add constraint "order_item_photo_id_foreign" foreign key ("photo_id") references "buyer_photo" ("id") on update cascade on delete restrict;`,
    );

    this.addSql(
      `alter table "order_event" add constraint "order_event_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "order_event" add constraint "order_event_order_id_foreign" foreign key ("order_id") references "order" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "order_event" add constraint "order_event_item_id_foreign" foreign key ("item_id") references "order_item" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "studio" add column "low_resolution_policy" text check ("low_resolution_policy" in ('confirm', 'refuse')) not null default 'confirm', add column "pickup_enabled" boolean not null default false, add column "pickup_note" varchar(300) not null default '', add column "next_order_number" int not null default 1001;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "order_item" drop constraint "order_item_order_id_foreign";`);

    this.addSql(`alter table "order_event" drop constraint "order_event_order_id_foreign";`);

    this.addSql(`alter table "order_item" drop constraint "order_item_photo_id_foreign";`);

    this.addSql(`alter table "order_event" drop constraint "order_event_item_id_foreign";`);

    this.addSql(`drop table if exists "payment_event" cascade;`);

    this.addSql(`drop table if exists "shipping_rate" cascade;`);

    this.addSql(`drop table if exists "order" cascade;`);

    this.addSql(`drop table if exists "buyer_photo" cascade;`);

    this.addSql(`drop table if exists "order_item" cascade;`);

    this.addSql(`drop table if exists "order_event" cascade;`);

    this.addSql(
      `alter table "studio" drop column "low_resolution_policy", drop column "pickup_enabled", drop column "pickup_note", drop column "next_order_number";`,
    );
  }
}
