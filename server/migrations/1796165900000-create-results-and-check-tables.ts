import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Shear results (uploads, result sets and their keys, manual matches, mapping templates) and check runs with their
 * per-member results. Triggers make a finished run and its member rows refuse any update: they are the record a
 * reviewer relies on.
 */
export class CreateResultsAndCheckTables1796165900000 implements MigrationInterface {
  name = 'CreateResultsAndCheckTables1796165900000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "results_upload" ("id" varchar PRIMARY KEY NOT NULL, "projectId" varchar NOT NULL, "fileName" varchar(255) NOT NULL, "format" varchar CHECK( "format" IN ('csv','xlsx') ) NOT NULL, "sizeBytes" integer NOT NULL, "sha256" varchar(64) NOT NULL, "fileKey" varchar(512) NOT NULL, "sheets" text, "createdById" varchar, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_da7bb20b5ac99a29b997b458b0e" FOREIGN KEY ("projectId") REFERENCES "project" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_c5ba7830fda6a8314a833838ca1" FOREIGN KEY ("createdById") REFERENCES "app_user" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_da7bb20b5ac99a29b997b458b0" ON "results_upload" ("projectId")`);

    await q.query(
      `CREATE TABLE "result_set" ("id" varchar PRIMARY KEY NOT NULL, "projectId" varchar NOT NULL, "modelRevisionId" varchar NOT NULL, "name" varchar(200) NOT NULL, "fileName" varchar(255) NOT NULL, "format" varchar CHECK( "format" IN ('csv','xlsx') ) NOT NULL, "sheet" varchar(255), "sha256" varchar(64) NOT NULL, "fileKey" varchar(512) NOT NULL, "governingKey" varchar(512) NOT NULL, "mapping" text NOT NULL, "geometry" text, "rowCount" integer NOT NULL, "memberKeyCount" integer NOT NULL, "combinations" text NOT NULL, "forceUnit" varchar CHECK( "forceUnit" IN ('N','kN','kip','lbf') ) NOT NULL, "matching" text NOT NULL, "createdById" varchar, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_5793c5fead7882b84464f047f5d" FOREIGN KEY ("projectId") REFERENCES "project" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_e1d2ffb4fe72a99ee8fe25afcbe" FOREIGN KEY ("createdById") REFERENCES "app_user" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_8558ab64010b31c31b51b64eac" ON "result_set" ("projectId", "createdAt")`);

    await q.query(
      `CREATE TABLE "result_key" ("resultSetId" varchar NOT NULL, "keyIndex" integer NOT NULL, "memberKey" text NOT NULL, "rowCount" integer NOT NULL, "firstRow" integer NOT NULL, "ends" text, CONSTRAINT "FK_4d97df8f2ea0f3f63825e9b5a5e" FOREIGN KEY ("resultSetId") REFERENCES "result_set" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, PRIMARY KEY ("resultSetId", "keyIndex"))`,
    );
    await q.query(`CREATE INDEX "IDX_28da37c3df7cbdb45fd69e4efc" ON "result_key" ("memberKey")`);
    await q.query(`CREATE UNIQUE INDEX "IDX_d229e22db139366d388f14634a" ON "result_key" ("resultSetId", "memberKey")`);

    await q.query(
      `CREATE TABLE "result_manual_match" ("projectId" varchar NOT NULL, "memberKey" text NOT NULL, "globalId" varchar(64) NOT NULL, "updatedById" varchar, "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_40a5b7fc21d06702a5ed9d42710" FOREIGN KEY ("projectId") REFERENCES "project" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_617107eaeaaccb1791c08a59cb5" FOREIGN KEY ("updatedById") REFERENCES "app_user" ("id") ON DELETE SET NULL ON UPDATE NO ACTION, PRIMARY KEY ("projectId", "memberKey"))`,
    );

    await q.query(
      `CREATE TABLE "result_mapping_template" ("id" varchar PRIMARY KEY NOT NULL, "projectId" varchar NOT NULL, "name" varchar(120) NOT NULL, "mapping" text NOT NULL, "createdById" varchar, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_47171b7a3fbcd4b63e63404907f" FOREIGN KEY ("projectId") REFERENCES "project" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE UNIQUE INDEX "IDX_26c552ae888db1d19ad7165d23" ON "result_mapping_template" ("projectId", "name")`);

    await q.query(
      `CREATE TABLE "check_run" ("id" varchar PRIMARY KEY NOT NULL, "projectId" varchar NOT NULL, "status" varchar CHECK( "status" IN ('queued','running','done','failed') ) NOT NULL DEFAULT ('queued'), "error" varchar(2000), "standard" varchar CHECK( "standard" IN ('aisc360-22-lrfd','aisc360-22-asd','en1993-1-1') ) NOT NULL, "parameters" text NOT NULL, "engineVersion" varchar(120) NOT NULL, "modelRevisionId" varchar NOT NULL, "modelRevisionNumber" integer NOT NULL, "modelFileName" varchar(255) NOT NULL, "modelSha256" varchar(64) NOT NULL, "resultSetId" varchar NOT NULL, "resultSetName" varchar(200) NOT NULL, "resultsSha256" varchar(64) NOT NULL, "combinations" text NOT NULL, "poorMatchConfirmed" boolean NOT NULL DEFAULT (0), "summary" text, "createdById" varchar NOT NULL, "createdByName" varchar(120) NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "finishedAt" datetime, CONSTRAINT "FK_83973e46de4624ec37ba6fd0bdc" FOREIGN KEY ("projectId") REFERENCES "project" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_59f64e1704f93dd90eaa991b38" ON "check_run" ("projectId", "createdAt")`);

    await q.query(
      `CREATE TABLE "check_member_result" ("runId" varchar NOT NULL, "ordinal" integer NOT NULL, "globalId" varchar(64) NOT NULL, "tag" text, "name" text, "storey" text, "profileName" text, "grade" varchar(16), "status" varchar CHECK( "status" IN ('pass','warning','fail','not-checked','not-applicable') ) NOT NULL, "governingCombination" text, "VEd_kN" real, "VRd_kN" real, "utilisation" real, "tauMax_MPa" real, "tauAvgWeb_MPa" real, "flags" text NOT NULL, "detail" text NOT NULL, "combinations" text NOT NULL, CONSTRAINT "FK_387165c3ba05370dad23290dd7e" FOREIGN KEY ("runId") REFERENCES "check_run" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, PRIMARY KEY ("runId", "ordinal"))`,
    );
    await q.query(`CREATE INDEX "IDX_9177e8cd24e66cf3246daeb9d2" ON "check_member_result" ("runId", "tag")`);
    await q.query(`CREATE INDEX "IDX_054218869a55706cae9d274ed6" ON "check_member_result" ("runId", "profileName")`);
    await q.query(`CREATE INDEX "IDX_7dacd00eaace96a184a1cdb24d" ON "check_member_result" ("runId", "storey")`);
    await q.query(`CREATE INDEX "IDX_dc06babc0fed6066278bf78ccd" ON "check_member_result" ("runId", "status", "utilisation")`);
    await q.query(`CREATE INDEX "IDX_d184d839c43919b295fe628b56" ON "check_member_result" ("runId", "utilisation")`);
    await q.query(`CREATE INDEX "IDX_6a4bfeb5207852f54dcf109792" ON "check_member_result" ("runId", "globalId")`);

    await q.query(
      `CREATE TRIGGER "check_run_immutable" BEFORE UPDATE ON "check_run" WHEN OLD."status" IN ('done', 'failed') BEGIN SELECT RAISE(ABORT, 'a finished check run is an immutable record'); END`,
    );
    await q.query(
      `CREATE TRIGGER "check_member_result_immutable" BEFORE UPDATE ON "check_member_result" BEGIN SELECT RAISE(ABORT, 'check results are an immutable record'); END`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TRIGGER "check_member_result_immutable"`);
    await q.query(`DROP TRIGGER "check_run_immutable"`);
    for (const table of ['check_member_result', 'check_run', 'result_mapping_template', 'result_manual_match', 'result_key', 'result_set', 'results_upload']) {
      await q.query(`DROP TABLE "${table}"`);
    }
  }
}
