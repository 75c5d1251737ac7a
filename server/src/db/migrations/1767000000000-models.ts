import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Loop models and their immutable revisions. */
export class Models1767000000000 implements MigrationInterface {
  name = 'Models1767000000000';

  async up(db: QueryRunner): Promise<void> {
    await db.query(`CREATE TABLE "models" (
      "id" varchar(36) PRIMARY KEY NOT NULL,
      "name" varchar(120) NOT NULL,
      "description" text NOT NULL DEFAULT '',
      "tags" text NOT NULL DEFAULT '[]',
      "revision" integer NOT NULL CHECK ("revision" >= 1),
      "created_at" varchar(30) NOT NULL,
      "updated_at" varchar(30) NOT NULL,
      "created_by" varchar(36),
      "updated_by" varchar(36),
      "deleted_at" varchar(30))`);
    await db.query(`CREATE INDEX "IDX_models_updated_at" ON "models" ("updated_at")`);
    await db.query(`CREATE INDEX "IDX_models_name" ON "models" ("name")`);
    await db.query(`CREATE TABLE "model_revisions" (
      "model_id" varchar(36) NOT NULL REFERENCES "models" ("id") ON DELETE CASCADE,
      "revision" integer NOT NULL,
      "name" varchar(120) NOT NULL,
      "description" text NOT NULL,
      "tags" text NOT NULL,
      "plant" text NOT NULL,
      "compensator" text,
      "design" text NOT NULL,
      "comment" text NOT NULL DEFAULT '',
      "author_id" varchar(36),
      "created_at" varchar(30) NOT NULL,
      "content_hash" varchar(64) NOT NULL,
      PRIMARY KEY ("model_id", "revision"))`);
  }

  async down(db: QueryRunner): Promise<void> {
    await db.query(`DROP TABLE "model_revisions"`);
    await db.query(`DROP TABLE "models"`);
  }
}
