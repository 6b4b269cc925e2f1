import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Model revisions, their members (table columns, and the whole records apart), and project section catalogues. */
export class CreateModelTables1796164800000 implements MigrationInterface {
  name = 'CreateModelTables1796164800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "model_revision" ("id" varchar PRIMARY KEY NOT NULL, "projectId" varchar NOT NULL, "number" integer NOT NULL, "fileName" varchar(255) NOT NULL, "sizeBytes" integer NOT NULL, "sha256" varchar(64) NOT NULL, "note" varchar(2000) NOT NULL DEFAULT (''), "uploadedById" varchar, "uploadedAt" datetime NOT NULL DEFAULT (datetime('now')), "status" varchar CHECK( "status" IN ('queued','ingesting','ready','failed') ) NOT NULL DEFAULT ('queued'), "progressPhase" varchar(16), "progressFraction" real, "error" varchar(2000), "schema" varchar(16), "fileSchema" varchar(64), "lengthUnit" varchar(64), "application" varchar(255), "counts" text, "fileKey" varchar(512), "glbKey" varchar(512), "finishedAt" datetime, CONSTRAINT "FK_c17fe9d46249635a0a6d9d5dc55" FOREIGN KEY ("projectId") REFERENCES "project" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_a2dfd189099b1da24e7b28bd4aa" FOREIGN KEY ("uploadedById") REFERENCES "app_user" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_de3e030a407460c4009b374564" ON "model_revision" ("projectId", "sha256")`);
    await q.query(`CREATE UNIQUE INDEX "IDX_4bf6825b914e16a37e1bba760c" ON "model_revision" ("projectId", "number")`);

    await q.query(
      `CREATE TABLE "model_member" ("revisionId" varchar NOT NULL, "expressId" integer NOT NULL, "globalId" varchar(64) NOT NULL, "ifcClass" varchar(64) NOT NULL, "name" text, "tag" text, "storey" text, "status" varchar CHECK( "status" IN ('ok','not-applicable','flagged') ) NOT NULL, "reason" text, "profileName" text, "profileSource" varchar(16), "profileType" varchar(64), "fabrication" varchar(16), "depth_mm" real, "webThickness_mm" real, "flangeWidth_mm" real, "flangeThickness_mm" real, "grade" varchar(16), "fy_MPa" real, "gradeAssumed" boolean, "length_mm" real, "flags" text NOT NULL, CONSTRAINT "FK_d4210c88525fe8f0eace7afd021" FOREIGN KEY ("revisionId") REFERENCES "model_revision" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, PRIMARY KEY ("revisionId", "expressId"))`,
    );
    const memberIndexes: [name: string, column: string][] = [
      ['IDX_b98c0e73a41febe363ee5acc87', 'globalId'],
      ['IDX_7f43db5b592b58a5cb412a27bf', 'status'],
      ['IDX_6c6139092ff20ac89fb66f62b0', 'storey'],
      ['IDX_3a88d69453dda0f40d5e5a906b', 'profileName'],
      ['IDX_3d0fa996604853469f5d6ae882', 'tag'],
      ['IDX_93c981c1f371ca2bafe88a14e7', 'name'],
      ['IDX_128d82198433981a77570b3598', 'depth_mm'],
      ['IDX_099af9740d6c64421e84bfd74b', 'length_mm'],
    ];
    for (const [name, column] of memberIndexes) {
      await q.query(`CREATE INDEX "${name}" ON "model_member" ("revisionId", "${column}")`);
    }
    await q.query(
      `CREATE TABLE "model_member_record" ("revisionId" varchar NOT NULL, "expressId" integer NOT NULL, "record" text NOT NULL, CONSTRAINT "FK_1eb71ec5eb2734657cdebb9b429" FOREIGN KEY ("revisionId") REFERENCES "model_revision" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, PRIMARY KEY ("revisionId", "expressId"))`,
    );

    await q.query(
      `CREATE TABLE "project_catalogue" ("projectId" varchar PRIMARY KEY NOT NULL, "sections" text NOT NULL, "fileName" varchar(255) NOT NULL, "uploadedById" varchar, "uploadedAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_800ea49039885b19d2eba475f98" FOREIGN KEY ("projectId") REFERENCES "project" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['project_catalogue', 'model_member_record', 'model_member', 'model_revision']) await q.query(`DROP TABLE "${table}"`);
  }
}
