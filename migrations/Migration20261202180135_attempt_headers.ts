import { Migration } from "@mikro-orm/migrations";

export class Migration20261202180135_attempt_headers extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `alter table "delivery_attempts" add column "request_headers" jsonb null, add column "response_headers" jsonb null;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "delivery_attempts" drop column "request_headers", drop column "response_headers";`);
  }
}
