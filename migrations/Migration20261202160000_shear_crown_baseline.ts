import { Migration } from "@mikro-orm/migrations";

export class Migration20261202160000_shear_crown_baseline extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "shears" add column "crown_baseline_mm" double precision null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "shears" drop column "crown_baseline_mm";`);
  }
}
