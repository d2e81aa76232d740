import { Migration } from "@mikro-orm/migrations";

export class Migration20261202163000_backgauge_repeatability extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "shears" add column "backgauge_repeatability_mm" double precision null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "shears" drop column "backgauge_repeatability_mm";`);
  }
}
