import { Migration } from "@mikro-orm/migrations";

export class Migration20261202160834_console_sessions extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "sign_in_attempts" ("id" varchar(255) not null, "email" text not null, "address" text not null, "outcome" text not null, "created_at" timestamptz not null, constraint "sign_in_attempts_pkey" primary key ("id"));`,
    );
    this.addSql(
      `create index "sign_in_attempts_email_created_at_index" on "sign_in_attempts" ("email", "created_at");`,
    );

    this.addSql(
      `create table "console_sessions" ("id" varchar(255) not null, "user_id" varchar(255) not null, "created_at" timestamptz not null, "expires_at" timestamptz not null, "revoked_at" timestamptz null, "revoked_reason" text null, constraint "console_sessions_pkey" primary key ("id"));`,
    );
    this.addSql(
      `create index "console_sessions_user_id_revoked_at_index" on "console_sessions" ("user_id", "revoked_at");`,
    );

    this.addSql(
      `alter table "console_sessions" add constraint "console_sessions_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "sign_in_attempts" cascade;`);

    this.addSql(`drop table if exists "console_sessions" cascade;`);
  }
}
