import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Users, projects and memberships, invitation and reset links, and the dev outbox. */
export class CreateFoundationTables1796162400000 implements MigrationInterface {
  name = 'CreateFoundationTables1796162400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "app_user" ("id" varchar PRIMARY KEY NOT NULL, "email" varchar(254) NOT NULL, "name" varchar(120) NOT NULL, "passwordHash" varchar(100) NOT NULL, "isAdmin" boolean NOT NULL DEFAULT (0), "active" boolean NOT NULL DEFAULT (1), "sessionVersion" integer NOT NULL DEFAULT (0), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "lastSignInAt" datetime)`,
    );
    await q.query(`CREATE UNIQUE INDEX "IDX_3fa909d0e37c531ebc23770339" ON "app_user" ("email")`);

    await q.query(
      `CREATE TABLE "project" ("id" varchar PRIMARY KEY NOT NULL, "name" varchar(120) NOT NULL, "code" varchar(32) NOT NULL, "description" varchar(2000) NOT NULL DEFAULT (''), "client" varchar(200) NOT NULL DEFAULT (''), "location" varchar(200) NOT NULL DEFAULT (''), "standard" varchar CHECK( "standard" IN ('aisc360-22-lrfd','aisc360-22-asd','en1993-1-1') ) NOT NULL, "settings" text NOT NULL, "archived" boolean NOT NULL DEFAULT (0), "createdById" varchar, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')))`,
    );
    await q.query(`CREATE UNIQUE INDEX "IDX_b58774a8460d69d09c888158ab" ON "project" ("code")`);

    await q.query(
      `CREATE TABLE "project_member" ("projectId" varchar NOT NULL, "userId" varchar NOT NULL, "role" varchar CHECK( "role" IN ('coordinator','engineer','reviewer') ) NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_7115f82a61e31ac95b2681d83e4" FOREIGN KEY ("projectId") REFERENCES "project" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_e7520163dafa7c1104fd672caad" FOREIGN KEY ("userId") REFERENCES "app_user" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, PRIMARY KEY ("projectId", "userId"))`,
    );
    await q.query(`CREATE INDEX "IDX_e7520163dafa7c1104fd672caa" ON "project_member" ("userId")`);

    await q.query(
      `CREATE TABLE "invitation" ("id" varchar PRIMARY KEY NOT NULL, "email" varchar(254) NOT NULL, "name" varchar(120) NOT NULL DEFAULT (''), "isAdmin" boolean NOT NULL DEFAULT (0), "projectId" varchar, "role" varchar CHECK( "role" IN ('coordinator','engineer','reviewer') ), "tokenHash" varchar(64) NOT NULL, "expiresAt" datetime NOT NULL, "usedAt" datetime, "invitedById" varchar, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_01d3fb6559feecba90b55aef890" FOREIGN KEY ("projectId") REFERENCES "project" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_bcb0a0d2333443083582a05cdd" ON "invitation" ("email")`);
    await q.query(`CREATE UNIQUE INDEX "IDX_676ef6471ce7176869d73365a4" ON "invitation" ("tokenHash")`);

    await q.query(
      `CREATE TABLE "password_reset" ("id" varchar PRIMARY KEY NOT NULL, "userId" varchar NOT NULL, "tokenHash" varchar(64) NOT NULL, "expiresAt" datetime NOT NULL, "usedAt" datetime, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_05baebe80e9f8fab8207eda250c" FOREIGN KEY ("userId") REFERENCES "app_user" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_05baebe80e9f8fab8207eda250" ON "password_reset" ("userId")`);
    await q.query(`CREATE UNIQUE INDEX "IDX_dc6908de54eb09f588adfdb285" ON "password_reset" ("tokenHash")`);

    await q.query(
      `CREATE TABLE "outbox_message" ("id" varchar PRIMARY KEY NOT NULL, "from" varchar(320) NOT NULL DEFAULT (''), "to" varchar(2000) NOT NULL, "subject" varchar(998) NOT NULL DEFAULT (''), "text" text NOT NULL DEFAULT (''), "html" text NOT NULL DEFAULT (''), "receivedAt" datetime NOT NULL)`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['outbox_message', 'password_reset', 'invitation', 'project_member', 'project', 'app_user']) {
      await q.query(`DROP TABLE "${table}"`);
    }
  }
}
