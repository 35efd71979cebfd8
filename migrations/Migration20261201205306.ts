import { Migration } from '@mikro-orm/migrations';

export class Migration20261201205306 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "material" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "name" varchar(80) not null, "family" varchar(20) not null, "surface_colour" varchar(7) not null, "mark_colour" varchar(7) not null, "default_tone" text check ("default_tone" in ('positive', 'negative')) not null, "lines_per_inch_min" int not null, "lines_per_inch_max" int not null, "safety_notes" text not null, "forbidden_on" jsonb not null, "forbidden_reason" varchar(300) not null, constraint "material_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "material" add constraint "material_studio_id_name_unique" unique ("studio_id", "name");`);

    this.addSql(
      `create table "machine" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "name" varchar(80) not null, "laser_kind" text check ("laser_kind" in ('co2', 'fibre', 'diode')) not null, "power_watts" double precision not null, "bed_width_mm" double precision not null, "bed_height_mm" double precision not null, "speed_unit" text check ("speed_unit" in ('mm/s', 'in/s', 'percent')) not null, "notes" text not null, constraint "machine_pkey" primary key ("id"));`,
    );

    this.addSql(
      `create table "recipe" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "material_id" uuid not null, "machine_id" uuid not null, "lines_per_inch" int not null, "halftone_method" varchar(40) not null, "tone" text check ("tone" in ('positive', 'negative')) not null, "speed" double precision not null, "power_min_percent" double precision not null, "power_max_percent" double precision not null, "passes" int not null, "notes" text not null, constraint "recipe_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "recipe" add constraint "recipe_material_id_machine_id_unique" unique ("material_id", "machine_id");`);

    this.addSql(
      `create table "blank" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "name" varchar(120) not null, "description" text not null, "material_id" uuid not null, "shape" text check ("shape" in ('rectangle', 'rounded-rectangle', 'oval', 'circle')) not null, "status" text check ("status" in ('draft', 'active', 'archived')) not null, "sort_order" int not null, constraint "blank_pkey" primary key ("id"));`,
    );

    this.addSql(
      `create table "blank_size" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "studio_id" uuid not null, "blank_id" uuid not null, "label" varchar(60) not null, "outer_width_mm" double precision not null, "outer_height_mm" double precision not null, "area_width_mm" double precision not null, "area_height_mm" double precision not null, "orientation" text check ("orientation" in ('portrait', 'landscape', 'either')) not null, "price_minor" int not null, "stock" int null, "sku" varchar(60) not null, constraint "blank_size_pkey" primary key ("id"));`,
    );

    this.addSql(
      `alter table "material" add constraint "material_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "machine" add constraint "machine_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "recipe" add constraint "recipe_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "recipe" add constraint "recipe_material_id_foreign" foreign key ("material_id") references "material" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "recipe" add constraint "recipe_machine_id_foreign" foreign key ("machine_id") references "machine" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "blank" add constraint "blank_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "blank" add constraint "blank_material_id_foreign" foreign key ("material_id") references "material" ("id") on update cascade on delete restrict;`,
    );

    this.addSql(
      `alter table "blank_size" add constraint "blank_size_studio_id_foreign" foreign key ("studio_id") references "studio" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "blank_size" add constraint "blank_size_blank_id_foreign" foreign key ("blank_id") references "blank" ("id") on update cascade on delete cascade;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "recipe" drop constraint "recipe_material_id_foreign";`);

    this.addSql(`alter table "blank" drop constraint "blank_material_id_foreign";`);

    this.addSql(`alter table "recipe" drop constraint "recipe_machine_id_foreign";`);

    this.addSql(`alter table "blank_size" drop constraint "blank_size_blank_id_foreign";`);

    this.addSql(`drop table if exists "material" cascade;`);

    this.addSql(`drop table if exists "machine" cascade;`);

    this.addSql(`drop table if exists "recipe" cascade;`);

    this.addSql(`drop table if exists "blank" cascade;`);

    this.addSql(`drop table if exists "blank_size" cascade;`);
  }
}
