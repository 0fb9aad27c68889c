import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Sessions keyed by sha256(session id) with the signed-in user, an opaque public handle, the sign-in time
 * (absolute lifetime), the last touch and the sign-in's browser and address (server/db/entities/session.entity.ts;
 * issue 14 items 2, 3 and 6).
 *
 * The old rows are keyed by the raw session id and cannot be converted meaningfully (no user column, no
 * sign-in time), so this migration DELETES every existing session: everyone signs in again once.
 */
export class HashedSessions1796187000000 implements MigrationInterface {
    name = 'HashedSessions1796187000000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "IDX_50762206f116cd47d1c3fec396"`);
        await queryRunner.query(`DROP TABLE "sessions"`);
        await queryRunner.query(`CREATE TABLE "sessions" ("sid" varchar(64) PRIMARY KEY NOT NULL, "publicId" varchar(32) NOT NULL, "userId" integer, "expiresAt" bigint NOT NULL, "createdAt" bigint NOT NULL, "lastSeenAt" bigint NOT NULL, "userAgent" varchar(160) NOT NULL DEFAULT (''), "ip" varchar(64) NOT NULL DEFAULT (''), "data" text NOT NULL, CONSTRAINT "UQ_de242cf8351e2c2dab06b3a6e7a" UNIQUE ("publicId"))`);
        await queryRunner.query(`CREATE INDEX "IDX_50762206f116cd47d1c3fec396" ON "sessions" ("expiresAt") `);
        await queryRunner.query(`CREATE INDEX "IDX_sessions_userId" ON "sessions" ("userId") `);
    }

    /** Back to the raw-id table; the sessions go again (they are keyed by a hash the old code cannot use). */
    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "IDX_sessions_userId"`);
        await queryRunner.query(`DROP INDEX "IDX_50762206f116cd47d1c3fec396"`);
        await queryRunner.query(`DROP TABLE "sessions"`);
        await queryRunner.query(`CREATE TABLE "sessions" ("sid" varchar(128) PRIMARY KEY NOT NULL, "expiresAt" bigint NOT NULL, "data" text NOT NULL)`);
        await queryRunner.query(`CREATE INDEX "IDX_50762206f116cd47d1c3fec396" ON "sessions" ("expiresAt") `);
    }

}
