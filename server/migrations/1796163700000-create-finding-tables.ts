import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Findings with their comments and history, saved viewpoints, and each user's finding e-mail preferences. */
export class CreateFindingTables1796163700000 implements MigrationInterface {
  name = 'CreateFindingTables1796163700000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "finding" ("id" varchar PRIMARY KEY NOT NULL, "projectId" varchar NOT NULL, "number" integer NOT NULL, "guid" varchar(36) NOT NULL, "kind" varchar CHECK( "kind" IN ('web-shear-fail','web-shear-warning','flag','manual') ) NOT NULL, "title" varchar(200) NOT NULL, "description" varchar(4000) NOT NULL DEFAULT (''), "status" varchar CHECK( "status" IN ('open','in-progress','resolved','ready-to-verify','verified','accepted') ) NOT NULL DEFAULT ('open'), "priority" varchar CHECK( "priority" IN ('low','normal','high','critical') ) NOT NULL DEFAULT ('normal'), "assigneeId" varchar, "dueDate" varchar(10), "labels" text NOT NULL, "memberGlobalIds" text NOT NULL, "memberKey" varchar(22), "memberTag" varchar(200), "memberLabel" varchar(400), "runId" varchar, "revisionNumber" integer, "utilisation" real, "justification" text, "viewpoint" text, "snapshotKey" varchar, "createdById" varchar, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_b8132078b91c3ce0d406507ad24" FOREIGN KEY ("projectId") REFERENCES "project" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_2497a7edcdb3a96071f0d349f55" FOREIGN KEY ("assigneeId") REFERENCES "app_user" ("id") ON DELETE SET NULL ON UPDATE NO ACTION, CONSTRAINT "FK_ded28a843eab8d0b07026d6ca07" FOREIGN KEY ("createdById") REFERENCES "app_user" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE UNIQUE INDEX "IDX_88cf23352b8d20fb81895e5ea6" ON "finding" ("guid")`);
    await q.query(`CREATE UNIQUE INDEX "IDX_d77d012c30e099462dd8db2b21" ON "finding" ("projectId", "memberKey", "kind")`);
    await q.query(`CREATE UNIQUE INDEX "IDX_90f520216ee1a5bd8ec585af13" ON "finding" ("projectId", "number")`);

    await q.query(
      `CREATE TABLE "finding_comment" ("id" varchar PRIMARY KEY NOT NULL, "findingId" varchar NOT NULL, "guid" varchar(36) NOT NULL, "authorId" varchar, "authorEmail" varchar(254) NOT NULL, "text" varchar(4000) NOT NULL, "createdAt" datetime NOT NULL, CONSTRAINT "FK_b95c22598eee2eec4eaec8e2556" FOREIGN KEY ("findingId") REFERENCES "finding" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_fcd42e85142c58940e80d2d8688" FOREIGN KEY ("authorId") REFERENCES "app_user" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_b95c22598eee2eec4eaec8e255" ON "finding_comment" ("findingId")`);
    await q.query(`CREATE UNIQUE INDEX "IDX_fdbfa280a29b9237f390793a0a" ON "finding_comment" ("guid")`);

    await q.query(
      `CREATE TABLE "finding_change" ("id" varchar PRIMARY KEY NOT NULL, "findingId" varchar NOT NULL, "actorId" varchar, "source" varchar CHECK( "source" IN ('user','system','bcf-import') ) NOT NULL, "field" varchar(40) NOT NULL, "fromValue" text, "toValue" text, "at" datetime NOT NULL, CONSTRAINT "FK_1b07146846fbc638f256f3579a1" FOREIGN KEY ("findingId") REFERENCES "finding" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_33b7365e3b7a9a30a9b289e9eba" FOREIGN KEY ("actorId") REFERENCES "app_user" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_1b07146846fbc638f256f3579a" ON "finding_change" ("findingId")`);

    await q.query(
      `CREATE TABLE "saved_viewpoint" ("id" varchar PRIMARY KEY NOT NULL, "projectId" varchar NOT NULL, "name" varchar(120) NOT NULL, "camera" text NOT NULL, "visibleGlobalIds" text, "selectedGlobalIds" text NOT NULL, "sectionPlane" text, "createdById" varchar, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_bd8ba84447e045239ba8f0d929a" FOREIGN KEY ("projectId") REFERENCES "project" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_bd8ba84447e045239ba8f0d929" ON "saved_viewpoint" ("projectId")`);

    await q.query(
      `CREATE TABLE "notification_preference" ("userId" varchar PRIMARY KEY NOT NULL, "assigned" boolean NOT NULL DEFAULT (1), "statusChanged" boolean NOT NULL DEFAULT (1), "mentioned" boolean NOT NULL DEFAULT (1), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_c8721bd56ae600308745ad49744" FOREIGN KEY ("userId") REFERENCES "app_user" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['notification_preference', 'saved_viewpoint', 'finding_change', 'finding_comment', 'finding']) {
      await q.query(`DROP TABLE "${table}"`);
    }
  }
}
