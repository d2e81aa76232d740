import { Migration } from "@mikro-orm/migrations";

export class Migration20261203070000_remnant_size extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "shops" add column "remnant_min_mm" double precision null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "shops" drop column "remnant_min_mm";`);
  }
}
