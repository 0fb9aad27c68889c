import { MigrationInterface, QueryRunner } from "typeorm";

export class Init1764625000000 implements MigrationInterface {
    name = 'Init1764625000000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE "users" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "email" varchar(254) NOT NULL, "name" varchar(120) NOT NULL, "passwordHash" varchar(300) NOT NULL, "isAdmin" boolean NOT NULL DEFAULT (0), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "UQ_97672ac88f789774dd47f7c8be3" UNIQUE ("email"))`);
        await queryRunner.query(`CREATE TABLE "productions" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "name" varchar(120) NOT NULL, "description" text NOT NULL DEFAULT (''), "isDemo" boolean NOT NULL DEFAULT (0), "createdAt" datetime NOT NULL DEFAULT (datetime('now')))`);
        await queryRunner.query(`CREATE TABLE "memberships" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "role" varchar(20) NOT NULL, "department" varchar(20) NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "userId" integer NOT NULL, "productionId" integer NOT NULL, CONSTRAINT "UQ_cd4cda9f25ef1cd20c0bdb642be" UNIQUE ("userId", "productionId"))`);
        await queryRunner.query(`CREATE TABLE "invitations" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "email" varchar(254) NOT NULL, "role" varchar(20) NOT NULL, "department" varchar(20) NOT NULL, "tokenHash" varchar(64) NOT NULL, "expiresAt" datetime NOT NULL, "acceptedAt" datetime, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "invitedById" integer, CONSTRAINT "UQ_a6eb6f2543de8a5a4c148b32a18" UNIQUE ("tokenHash"))`);
        await queryRunner.query(`CREATE TABLE "password_resets" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "tokenHash" varchar(64) NOT NULL, "expiresAt" datetime NOT NULL, "usedAt" datetime, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "userId" integer NOT NULL, CONSTRAINT "UQ_7f6aae0fcc807c9e7194ca5cc4a" UNIQUE ("tokenHash"))`);
        await queryRunner.query(`CREATE TABLE "sessions" ("sid" varchar(128) PRIMARY KEY NOT NULL, "expiresAt" bigint NOT NULL, "data" text NOT NULL)`);
        await queryRunner.query(`CREATE INDEX "IDX_50762206f116cd47d1c3fec396" ON "sessions" ("expiresAt") `);
        await queryRunner.query(`CREATE TABLE "mail_messages" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "to" varchar(254) NOT NULL, "from" varchar(254) NOT NULL, "subject" varchar(300) NOT NULL, "text" text NOT NULL, "html" text NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')))`);
        await queryRunner.query(`CREATE TABLE "temporary_memberships" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "role" varchar(20) NOT NULL, "department" varchar(20) NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "userId" integer NOT NULL, "productionId" integer NOT NULL, CONSTRAINT "UQ_cd4cda9f25ef1cd20c0bdb642be" UNIQUE ("userId", "productionId"), CONSTRAINT "FK_187d573e43b2c2aa3960df20b78" FOREIGN KEY ("userId") REFERENCES "users" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_ca2490541fb4be792c67c897eb0" FOREIGN KEY ("productionId") REFERENCES "productions" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`);
        await queryRunner.query(`INSERT INTO "temporary_memberships"("id", "role", "department", "createdAt", "userId", "productionId") SELECT "id", "role", "department", "createdAt", "userId", "productionId" FROM "memberships"`);
        await queryRunner.query(`DROP TABLE "memberships"`);
        await queryRunner.query(`ALTER TABLE "temporary_memberships" RENAME TO "memberships"`);
        await queryRunner.query(`CREATE TABLE "temporary_invitations" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "email" varchar(254) NOT NULL, "role" varchar(20) NOT NULL, "department" varchar(20) NOT NULL, "tokenHash" varchar(64) NOT NULL, "expiresAt" datetime NOT NULL, "acceptedAt" datetime, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "invitedById" integer, CONSTRAINT "UQ_a6eb6f2543de8a5a4c148b32a18" UNIQUE ("tokenHash"), CONSTRAINT "FK_a565813f5336a8d12dd179bc384" FOREIGN KEY ("productionId") REFERENCES "productions" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_b60325e5302be0dad38b423314c" FOREIGN KEY ("invitedById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`);
        await queryRunner.query(`INSERT INTO "temporary_invitations"("id", "email", "role", "department", "tokenHash", "expiresAt", "acceptedAt", "createdAt", "productionId", "invitedById") SELECT "id", "email", "role", "department", "tokenHash", "expiresAt", "acceptedAt", "createdAt", "productionId", "invitedById" FROM "invitations"`);
        await queryRunner.query(`DROP TABLE "invitations"`);
        await queryRunner.query(`ALTER TABLE "temporary_invitations" RENAME TO "invitations"`);
        await queryRunner.query(`CREATE TABLE "temporary_password_resets" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "tokenHash" varchar(64) NOT NULL, "expiresAt" datetime NOT NULL, "usedAt" datetime, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "userId" integer NOT NULL, CONSTRAINT "UQ_7f6aae0fcc807c9e7194ca5cc4a" UNIQUE ("tokenHash"), CONSTRAINT "FK_d95569f623f28a0bf034a55099e" FOREIGN KEY ("userId") REFERENCES "users" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`);
        await queryRunner.query(`INSERT INTO "temporary_password_resets"("id", "tokenHash", "expiresAt", "usedAt", "createdAt", "userId") SELECT "id", "tokenHash", "expiresAt", "usedAt", "createdAt", "userId" FROM "password_resets"`);
        await queryRunner.query(`DROP TABLE "password_resets"`);
        await queryRunner.query(`ALTER TABLE "temporary_password_resets" RENAME TO "password_resets"`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "password_resets" RENAME TO "temporary_password_resets"`);
        await queryRunner.query(`CREATE TABLE "password_resets" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "tokenHash" varchar(64) NOT NULL, "expiresAt" datetime NOT NULL, "usedAt" datetime, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "userId" integer NOT NULL, CONSTRAINT "UQ_7f6aae0fcc807c9e7194ca5cc4a" UNIQUE ("tokenHash"))`);
        await queryRunner.query(`INSERT INTO "password_resets"("id", "tokenHash", "expiresAt", "usedAt", "createdAt", "userId") SELECT "id", "tokenHash", "expiresAt", "usedAt", "createdAt", "userId" FROM "temporary_password_resets"`);
        await queryRunner.query(`DROP TABLE "temporary_password_resets"`);
        await queryRunner.query(`ALTER TABLE "invitations" RENAME TO "temporary_invitations"`);
        await queryRunner.query(`CREATE TABLE "invitations" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "email" varchar(254) NOT NULL, "role" varchar(20) NOT NULL, "department" varchar(20) NOT NULL, "tokenHash" varchar(64) NOT NULL, "expiresAt" datetime NOT NULL, "acceptedAt" datetime, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "invitedById" integer, CONSTRAINT "UQ_a6eb6f2543de8a5a4c148b32a18" UNIQUE ("tokenHash"))`);
        await queryRunner.query(`INSERT INTO "invitations"("id", "email", "role", "department", "tokenHash", "expiresAt", "acceptedAt", "createdAt", "productionId", "invitedById") SELECT "id", "email", "role", "department", "tokenHash", "expiresAt", "acceptedAt", "createdAt", "productionId", "invitedById" FROM "temporary_invitations"`);
        await queryRunner.query(`DROP TABLE "temporary_invitations"`);
        await queryRunner.query(`ALTER TABLE "memberships" RENAME TO "temporary_memberships"`);
        await queryRunner.query(`CREATE TABLE "memberships" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "role" varchar(20) NOT NULL, "department" varchar(20) NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "userId" integer NOT NULL, "productionId" integer NOT NULL, CONSTRAINT "UQ_cd4cda9f25ef1cd20c0bdb642be" UNIQUE ("userId", "productionId"))`);
        await queryRunner.query(`INSERT INTO "memberships"("id", "role", "department", "createdAt", "userId", "productionId") SELECT "id", "role", "department", "createdAt", "userId", "productionId" FROM "temporary_memberships"`);
        await queryRunner.query(`DROP TABLE "temporary_memberships"`);
        await queryRunner.query(`DROP TABLE "mail_messages"`);
        await queryRunner.query(`DROP INDEX "IDX_50762206f116cd47d1c3fec396"`);
        await queryRunner.query(`DROP TABLE "sessions"`);
        await queryRunner.query(`DROP TABLE "password_resets"`);
        await queryRunner.query(`DROP TABLE "invitations"`);
        await queryRunner.query(`DROP TABLE "memberships"`);
        await queryRunner.query(`DROP TABLE "productions"`);
        await queryRunner.query(`DROP TABLE "users"`);
    }

}
