import { Migration } from "@mikro-orm/migrations";

export class Migration20261203060000_routing extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `alter table "shops" add column "routing_rule" text check ("routing_rule" in ('least_capacity', 'shortest_queue')) not null default 'least_capacity';`,
    );
    this.addSql(`alter table "programs" add column "routing" jsonb null;`);
    this.addSql(`alter table "plans" add column "routing" jsonb null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "plans" drop column "routing";`);
    this.addSql(`alter table "programs" drop column "routing";`);
    this.addSql(`alter table "shops" drop column "routing_rule";`);
  }
}
