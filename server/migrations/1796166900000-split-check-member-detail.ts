import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Keeps the table the results API sorts and filters narrow: each member's full engine result moves to
 * check_member_detail (a sort over 50,000 wide rows read every page of them), one lower-case `search` column serves
 * the text filter, and the indexes follow the table's filters with its default sort (storey or profile, then
 * utilisation) and its VEd sort. Existing runs keep their results; both tables refuse updates, as before.
 */
export class SplitCheckMemberDetail1796166900000 implements MigrationInterface {
  name = 'SplitCheckMemberDetail1796166900000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "check_member_detail" ("runId" varchar NOT NULL, "ordinal" integer NOT NULL, "detail" text NOT NULL, "combinations" text NOT NULL, CONSTRAINT "FK_d5e1ba5fc8ff03c30026e2de1d2" FOREIGN KEY ("runId") REFERENCES "check_run" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, PRIMARY KEY ("runId", "ordinal"))`,
    );
    await q.query(`INSERT INTO "check_member_detail" ("runId", "ordinal", "detail", "combinations") SELECT "runId", "ordinal", "detail", "combinations" FROM "check_member_result"`);
    await q.query(`DROP TRIGGER "check_member_result_immutable"`);
    await q.query(
      `CREATE TABLE "narrow_check_member_result" ("runId" varchar NOT NULL, "ordinal" integer NOT NULL, "globalId" varchar(64) NOT NULL, "tag" text, "name" text, "storey" text, "profileName" text, "grade" varchar(16), "status" varchar CHECK( "status" IN ('pass','warning','fail','not-checked','not-applicable') ) NOT NULL, "governingCombination" text, "VEd_kN" real, "VRd_kN" real, "utilisation" real, "tauMax_MPa" real, "tauAvgWeb_MPa" real, "flags" text NOT NULL, "search" text NOT NULL, CONSTRAINT "FK_387165c3ba05370dad23290dd7e" FOREIGN KEY ("runId") REFERENCES "check_run" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, PRIMARY KEY ("runId", "ordinal"))`,
    );
    // SQLite's lower() folds ASCII only; rows written from now on are folded by the server (searchTextOf).
    await q.query(
      `INSERT INTO "narrow_check_member_result" ("runId", "ordinal", "globalId", "tag", "name", "storey", "profileName", "grade", "status", "governingCombination", "VEd_kN", "VRd_kN", "utilisation", "tauMax_MPa", "tauAvgWeb_MPa", "flags", "search") SELECT "runId", "ordinal", "globalId", "tag", "name", "storey", "profileName", "grade", "status", "governingCombination", "VEd_kN", "VRd_kN", "utilisation", "tauMax_MPa", "tauAvgWeb_MPa", "flags", lower("globalId" || coalesce(char(10) || "tag", '') || coalesce(char(10) || "name", '') || coalesce(char(10) || "profileName", '')) FROM "check_member_result"`,
    );
    await q.query(`DROP TABLE "check_member_result"`);
    await q.query(`ALTER TABLE "narrow_check_member_result" RENAME TO "check_member_result"`);
    await q.query(`CREATE INDEX "IDX_9177e8cd24e66cf3246daeb9d2" ON "check_member_result" ("runId", "tag")`);
    await q.query(`CREATE INDEX "IDX_f4d055383d23a7b08977e4e56d" ON "check_member_result" ("runId", "profileName", "utilisation")`);
    await q.query(`CREATE INDEX "IDX_1060e4e0414b050dcf7e67fd0c" ON "check_member_result" ("runId", "storey", "utilisation")`);
    await q.query(`CREATE INDEX "IDX_dc06babc0fed6066278bf78ccd" ON "check_member_result" ("runId", "status", "utilisation")`);
    await q.query(`CREATE INDEX "IDX_d184d839c43919b295fe628b56" ON "check_member_result" ("runId", "utilisation")`);
    await q.query(`CREATE INDEX "IDX_6a4bfeb5207852f54dcf109792" ON "check_member_result" ("runId", "globalId")`);
    await q.query(`CREATE INDEX "IDX_b6f9c21bcd364d5b3d0fcccbfb" ON "check_member_result" ("runId", "VEd_kN")`);
    await q.query(`CREATE INDEX "IDX_8f499754f2d9a47cdf2d5fb823" ON "check_member_result" ("runId", "search")`);
    await q.query(`CREATE INDEX "IDX_3dda7b7b3e4d222329fc56f609" ON "check_member_result" ("runId", "status", "profileName", "storey", "utilisation")`);
    await q.query(immutableTrigger('check_member_result'));
    await q.query(immutableTrigger('check_member_detail'));
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TRIGGER "check_member_detail_immutable"`);
    await q.query(`DROP TRIGGER "check_member_result_immutable"`);
    await q.query(
      `CREATE TABLE "narrow_check_member_result" ("runId" varchar NOT NULL, "ordinal" integer NOT NULL, "globalId" varchar(64) NOT NULL, "tag" text, "name" text, "storey" text, "profileName" text, "grade" varchar(16), "status" varchar CHECK( "status" IN ('pass','warning','fail','not-checked','not-applicable') ) NOT NULL, "governingCombination" text, "VEd_kN" real, "VRd_kN" real, "utilisation" real, "tauMax_MPa" real, "tauAvgWeb_MPa" real, "flags" text NOT NULL, "detail" text NOT NULL, "combinations" text NOT NULL, CONSTRAINT "FK_387165c3ba05370dad23290dd7e" FOREIGN KEY ("runId") REFERENCES "check_run" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, PRIMARY KEY ("runId", "ordinal"))`,
    );
    await q.query(
      `INSERT INTO "narrow_check_member_result" ("runId", "ordinal", "globalId", "tag", "name", "storey", "profileName", "grade", "status", "governingCombination", "VEd_kN", "VRd_kN", "utilisation", "tauMax_MPa", "tauAvgWeb_MPa", "flags", "detail", "combinations") SELECT r."runId", r."ordinal", r."globalId", r."tag", r."name", r."storey", r."profileName", r."grade", r."status", r."governingCombination", r."VEd_kN", r."VRd_kN", r."utilisation", r."tauMax_MPa", r."tauAvgWeb_MPa", r."flags", d."detail", d."combinations" FROM "check_member_result" r JOIN "check_member_detail" d ON d."runId" = r."runId" AND d."ordinal" = r."ordinal"`,
    );
    await q.query(`DROP TABLE "check_member_result"`);
    await q.query(`ALTER TABLE "narrow_check_member_result" RENAME TO "check_member_result"`);
    await q.query(`CREATE INDEX "IDX_9177e8cd24e66cf3246daeb9d2" ON "check_member_result" ("runId", "tag")`);
    await q.query(`CREATE INDEX "IDX_054218869a55706cae9d274ed6" ON "check_member_result" ("runId", "profileName")`);
    await q.query(`CREATE INDEX "IDX_7dacd00eaace96a184a1cdb24d" ON "check_member_result" ("runId", "storey")`);
    await q.query(`CREATE INDEX "IDX_dc06babc0fed6066278bf78ccd" ON "check_member_result" ("runId", "status", "utilisation")`);
    await q.query(`CREATE INDEX "IDX_d184d839c43919b295fe628b56" ON "check_member_result" ("runId", "utilisation")`);
    await q.query(`CREATE INDEX "IDX_6a4bfeb5207852f54dcf109792" ON "check_member_result" ("runId", "globalId")`);
    await q.query(`DROP TABLE "check_member_detail"`);
    await q.query(immutableTrigger('check_member_result'));
  }
}

function immutableTrigger(table: string): string {
  return `CREATE TRIGGER "${table}_immutable" BEFORE UPDATE ON "${table}" BEGIN SELECT RAISE(ABORT, 'check results are an immutable record'); END`;
}
