import { Migration } from "@mikro-orm/migrations";

export class Migration20261202155743_text_columns extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "idempotency_records" alter column "path" type text using ("path"::text);`);

    this.addSql(`alter table "request_logs" alter column "route" type text using ("route"::text);`);
    this.addSql(`alter table "request_logs" alter column "path" type text using ("path"::text);`);
    this.addSql(`alter table "request_logs" alter column "idempotency_key" type text using ("idempotency_key"::text);`);

    this.addSql(`alter table "shops" alter column "name" type text using ("name"::text);`);

    this.addSql(`alter table "shears" alter column "name" type text using ("name"::text);`);

    this.addSql(`alter table "programs" alter column "reference" type text using ("reference"::text);`);
    this.addSql(`alter table "programs" alter column "title" type text using ("title"::text);`);
    this.addSql(`alter table "programs" alter column "grade_code" type text using ("grade_code"::text);`);

    this.addSql(`alter table "plans" alter column "reference" type text using ("reference"::text);`);
    this.addSql(`alter table "plans" alter column "title" type text using ("title"::text);`);

    this.addSql(`alter table "invitations" alter column "email" type text using ("email"::text);`);

    this.addSql(`alter table "grades" alter column "code" type text using ("code"::text);`);
    this.addSql(`alter table "grades" alter column "name" type text using ("name"::text);`);
    this.addSql(`alter table "grades" alter column "standard" type text using ("standard"::text);`);

    this.addSql(`alter table "api_keys" alter column "name" type text using ("name"::text);`);

    this.addSql(`alter table "users" alter column "email" type text using ("email"::text);`);
    this.addSql(`alter table "users" alter column "name" type text using ("name"::text);`);

    this.addSql(`alter table "webhook_endpoints" alter column "description" type text using ("description"::text);`);
    this.addSql(
      `alter table "webhook_endpoints" alter column "disabled_reason" type text using ("disabled_reason"::text);`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "api_keys" alter column "name" type varchar(255) using ("name"::varchar(255));`);

    this.addSql(`alter table "grades" alter column "code" type varchar(255) using ("code"::varchar(255));`);
    this.addSql(`alter table "grades" alter column "name" type varchar(255) using ("name"::varchar(255));`);
    this.addSql(`alter table "grades" alter column "standard" type varchar(255) using ("standard"::varchar(255));`);

    this.addSql(
      `alter table "idempotency_records" alter column "path" type varchar(255) using ("path"::varchar(255));`,
    );

    this.addSql(`alter table "invitations" alter column "email" type varchar(255) using ("email"::varchar(255));`);

    this.addSql(`alter table "plans" alter column "reference" type varchar(255) using ("reference"::varchar(255));`);
    this.addSql(`alter table "plans" alter column "title" type varchar(255) using ("title"::varchar(255));`);

    this.addSql(`alter table "programs" alter column "reference" type varchar(255) using ("reference"::varchar(255));`);
    this.addSql(`alter table "programs" alter column "title" type varchar(255) using ("title"::varchar(255));`);
    this.addSql(
      `alter table "programs" alter column "grade_code" type varchar(255) using ("grade_code"::varchar(255));`,
    );

    this.addSql(`alter table "request_logs" alter column "route" type varchar(255) using ("route"::varchar(255));`);
    this.addSql(`alter table "request_logs" alter column "path" type varchar(255) using ("path"::varchar(255));`);
    this.addSql(
      `alter table "request_logs" alter column "idempotency_key" type varchar(255) using ("idempotency_key"::varchar(255));`,
    );

    this.addSql(`alter table "shears" alter column "name" type varchar(255) using ("name"::varchar(255));`);

    this.addSql(`alter table "shops" alter column "name" type varchar(255) using ("name"::varchar(255));`);

    this.addSql(`alter table "users" alter column "email" type varchar(255) using ("email"::varchar(255));`);
    this.addSql(`alter table "users" alter column "name" type varchar(255) using ("name"::varchar(255));`);

    this.addSql(
      `alter table "webhook_endpoints" alter column "description" type varchar(255) using ("description"::varchar(255));`,
    );
    this.addSql(
      `alter table "webhook_endpoints" alter column "disabled_reason" type varchar(255) using ("disabled_reason"::varchar(255));`,
    );
  }
}
