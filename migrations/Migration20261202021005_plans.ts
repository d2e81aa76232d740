import { Migration } from "@mikro-orm/migrations";

export class Migration20261202021005_plans extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "plans" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "shear_id" varchar(255) not null, "reference" varchar(255) null, "title" varchar(255) null, "status" varchar(255) not null, "input" jsonb not null, "result" jsonb not null, "programs" jsonb not null default '[]', "created_at" timestamptz not null, constraint "plans_pkey" primary key ("id"));`,
    );
    this.addSql(`create index "plans_shop_id_id_index" on "plans" ("shop_id", "id");`);

    this.addSql(
      `alter table "plans" add constraint "plans_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "plans" add constraint "plans_shear_id_foreign" foreign key ("shear_id") references "shears" ("id") on update cascade on delete restrict;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "plans" cascade;`);
  }
}
