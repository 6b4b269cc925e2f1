import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The results table names the governing axis and check of each member ('major' / 'minor'; 'major-axis shear',
 * 'minor-axis shear', 'shear with bending'). Checked members of earlier runs take what their stored result says, and
 * where it says nothing (runs before section families) the major-axis shear, the only check those runs made. The
 * rows stay an immutable record: the trigger is lifted only for this fill.
 */
export class AddGoverningAxisAndCheck1796168900000 implements MigrationInterface {
  name = 'AddGoverningAxisAndCheck1796168900000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "check_member_result" ADD COLUMN "governingAxis" varchar(8)`);
    await q.query(`ALTER TABLE "check_member_result" ADD COLUMN "governingCheck" varchar(24)`);
    await q.query(`DROP TRIGGER "check_member_result_immutable"`);
    await q.query(
      `UPDATE "check_member_result" AS r SET
         "governingAxis" = coalesce((SELECT json_extract(d."detail", '$.governing.axis') FROM "check_member_detail" d WHERE d."runId" = r."runId" AND d."ordinal" = r."ordinal"), 'major'),
         "governingCheck" = coalesce((SELECT json_extract(d."detail", '$.governing.check') FROM "check_member_detail" d WHERE d."runId" = r."runId" AND d."ordinal" = r."ordinal"), 'major-axis shear')
       WHERE r."utilisation" IS NOT NULL`,
    );
    await q.query(IMMUTABLE_TRIGGER);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "check_member_result" DROP COLUMN "governingCheck"`);
    await q.query(`ALTER TABLE "check_member_result" DROP COLUMN "governingAxis"`);
  }
}

const IMMUTABLE_TRIGGER = `CREATE TRIGGER "check_member_result_immutable" BEFORE UPDATE ON "check_member_result" BEGIN SELECT RAISE(ABORT, 'check results are an immutable record'); END`;
