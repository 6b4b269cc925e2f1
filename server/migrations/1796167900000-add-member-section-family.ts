import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Members of every section family: model_member gains the family of the section (filtered and faceted) and a source
 * column wide enough for 'project-catalogue'; the sources are renamed ('ifc' → 'ifc-profile') and existing records,
 * all I-sections, get family 'I' in both tables.
 */
export class AddMemberSectionFamily1796167900000 implements MigrationInterface {
  name = 'AddMemberSectionFamily1796167900000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "wider_model_member" ("revisionId" varchar NOT NULL, "expressId" integer NOT NULL, "globalId" varchar(64) NOT NULL, "ifcClass" varchar(64) NOT NULL, "name" text, "tag" text, "storey" text, "status" varchar CHECK( "status" IN ('ok','not-applicable','flagged') ) NOT NULL, "reason" text, "profileName" text, "profileSource" varchar(20), "profileType" varchar(64), "profileFamily" varchar(16), "fabrication" varchar(16), "depth_mm" real, "webThickness_mm" real, "flangeWidth_mm" real, "flangeThickness_mm" real, "grade" varchar(16), "fy_MPa" real, "gradeAssumed" boolean, "length_mm" real, "flags" text NOT NULL, CONSTRAINT "FK_d4210c88525fe8f0eace7afd021" FOREIGN KEY ("revisionId") REFERENCES "model_revision" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, PRIMARY KEY ("revisionId", "expressId"))`,
    );
    await q.query(
      `INSERT INTO "wider_model_member" ("revisionId", "expressId", "globalId", "ifcClass", "name", "tag", "storey", "status", "reason", "profileName", "profileSource", "profileType", "fabrication", "depth_mm", "webThickness_mm", "flangeWidth_mm", "flangeThickness_mm", "grade", "fy_MPa", "gradeAssumed", "length_mm", "flags", "profileFamily") SELECT "revisionId", "expressId", "globalId", "ifcClass", "name", "tag", "storey", "status", "reason", "profileName", CASE "profileSource" WHEN 'ifc' THEN 'ifc-profile' ELSE "profileSource" END, "profileType", "fabrication", "depth_mm", "webThickness_mm", "flangeWidth_mm", "flangeThickness_mm", "grade", "fy_MPa", "gradeAssumed", "length_mm", "flags", CASE WHEN "profileName" IS NOT NULL OR "depth_mm" IS NOT NULL THEN 'I' END FROM "model_member"`,
    );
    await q.query(`DROP TABLE "model_member"`);
    await q.query(`ALTER TABLE "wider_model_member" RENAME TO "model_member"`);
    for (const [name, column] of MEMBER_INDEXES) await q.query(`CREATE INDEX "${name}" ON "model_member" ("revisionId", "${column}")`);
    await q.query(
      `UPDATE "model_member_record" SET "record" = json_set("record", '$.profile.family', 'I', '$.profile.source', CASE json_extract("record", '$.profile.source') WHEN 'ifc' THEN 'ifc-profile' ELSE json_extract("record", '$.profile.source') END) WHERE json_extract("record", '$.profile') IS NOT NULL`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "${FAMILY_INDEX[0]}"`);
    await q.query(`ALTER TABLE "model_member" DROP COLUMN "profileFamily"`);
  }
}

const FAMILY_INDEX: [name: string, column: string] = ['IDX_0f7fa7cfe65d5134280a952d17', 'profileFamily'];
const MEMBER_INDEXES: [name: string, column: string][] = [
  ['IDX_b98c0e73a41febe363ee5acc87', 'globalId'],
  ['IDX_7f43db5b592b58a5cb412a27bf', 'status'],
  ['IDX_6c6139092ff20ac89fb66f62b0', 'storey'],
  ['IDX_3a88d69453dda0f40d5e5a906b', 'profileName'],
  ['IDX_3d0fa996604853469f5d6ae882', 'tag'],
  ['IDX_93c981c1f371ca2bafe88a14e7', 'name'],
  ['IDX_128d82198433981a77570b3598', 'depth_mm'],
  ['IDX_099af9740d6c64421e84bfd74b', 'length_mm'],
  FAMILY_INDEX,
];
