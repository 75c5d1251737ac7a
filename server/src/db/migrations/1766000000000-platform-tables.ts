import type { MigrationInterface, QueryRunner } from 'typeorm';

/** People, sessions, invitations, API keys, embed tokens and the audit trail. */
export class PlatformTables1766000000000 implements MigrationInterface {
  name = 'PlatformTables1766000000000';

  async up(db: QueryRunner): Promise<void> {
    await db.query(`CREATE TABLE "users" (
      "id" varchar PRIMARY KEY NOT NULL,
      "email" varchar NOT NULL UNIQUE,
      "name" varchar NOT NULL,
      "role" varchar NOT NULL CHECK ("role" IN ('admin', 'engineer', 'viewer')),
      "status" varchar NOT NULL CHECK ("status" IN ('invited', 'active', 'deactivated')),
      "password_hash" varchar,
      "created_at" varchar NOT NULL,
      "updated_at" varchar NOT NULL)`);
    await db.query(`CREATE TABLE "invitations" (
      "id" varchar PRIMARY KEY NOT NULL,
      "user_id" varchar NOT NULL REFERENCES "users" ("id"),
      "token_hash" varchar NOT NULL UNIQUE,
      "invited_by" varchar NOT NULL REFERENCES "users" ("id"),
      "created_at" varchar NOT NULL,
      "expires_at" varchar NOT NULL,
      "accepted_at" varchar)`);
    await db.query(`CREATE TABLE "sessions" (
      "id" varchar PRIMARY KEY NOT NULL,
      "user_id" varchar NOT NULL REFERENCES "users" ("id"),
      "token_hash" varchar NOT NULL UNIQUE,
      "created_at" varchar NOT NULL,
      "expires_at" varchar NOT NULL,
      "revoked_at" varchar)`);
    await db.query(`CREATE INDEX "sessions_user" ON "sessions" ("user_id")`);
    await db.query(`CREATE TABLE "api_keys" (
      "id" varchar PRIMARY KEY NOT NULL,
      "name" varchar NOT NULL,
      "prefix" varchar NOT NULL,
      "secret_hash" varchar NOT NULL UNIQUE,
      "scopes" text NOT NULL,
      "created_by" varchar NOT NULL REFERENCES "users" ("id"),
      "created_at" varchar NOT NULL,
      "expires_at" varchar,
      "revoked_at" varchar,
      "last_used_at" varchar,
      "expiry_notice_sent_at" varchar)`);
    await db.query(`CREATE TABLE "embed_tokens" (
      "id" varchar PRIMARY KEY NOT NULL,
      "token_hash" varchar NOT NULL UNIQUE,
      "model_ids" text NOT NULL,
      "origins" text NOT NULL,
      "created_by" varchar NOT NULL REFERENCES "users" ("id"),
      "created_at" varchar NOT NULL,
      "expires_at" varchar NOT NULL)`);
    await db.query(`CREATE TABLE "audit_events" (
      "id" integer PRIMARY KEY AUTOINCREMENT NOT NULL,
      "at" varchar NOT NULL,
      "action" varchar NOT NULL,
      "actor_id" varchar,
      "target_type" varchar,
      "target_id" varchar,
      "detail" text)`);
    await db.query(`CREATE INDEX "audit_events_at" ON "audit_events" ("at")`);
    await db.query(`CREATE INDEX "audit_events_action" ON "audit_events" ("action")`);
  }

  async down(db: QueryRunner): Promise<void> {
    for (const table of ['audit_events', 'embed_tokens', 'api_keys', 'sessions', 'invitations', 'users']) {
      await db.query(`DROP TABLE "${table}"`);
    }
  }
}
