import { Migration } from "@mikro-orm/migrations";

export class Migration20261202005416_team extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "invitations" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "email" varchar(255) not null, "role" text check ("role" in ('owner', 'admin', 'developer', 'viewer')) not null, "token_hash" varchar(255) not null, "invited_by" varchar(255) not null, "expires_at" timestamptz not null, "accepted_at" timestamptz null, "revoked_at" timestamptz null, "created_at" timestamptz not null, constraint "invitations_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "invitations" add constraint "invitations_token_hash_unique" unique ("token_hash");`);

    this.addSql(
      `alter table "invitations" add constraint "invitations_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "invitations" cascade;`);
  }
}
