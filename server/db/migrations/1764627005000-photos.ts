import { MigrationInterface, QueryRunner } from "typeorm";

export class Photos1764627005000 implements MigrationInterface {
    name = 'Photos1764627005000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE "photos" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "department" varchar(20) NOT NULL, "format" varchar(10) NOT NULL, "bitDepth" integer NOT NULL, "width" integer NOT NULL, "height" integer NOT NULL, "previewWidth" integer NOT NULL, "previewHeight" integer NOT NULL, "fileBytes" integer NOT NULL, "iccProfile" varchar(200), "orientation" integer NOT NULL DEFAULT (1), "storageKey" varchar(64) NOT NULL, "originalName" varchar(200) NOT NULL DEFAULT (''), "isDemo" boolean NOT NULL DEFAULT (0), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "uploadedById" integer, CONSTRAINT "UQ_ce4d7204fe715dda244f3e21f8c" UNIQUE ("storageKey"))`);
        await queryRunner.query(`CREATE INDEX "IDX_5807a228543748486050119540" ON "photos" ("productionId", "createdAt") `);
        await queryRunner.query(`DROP INDEX "IDX_5807a228543748486050119540"`);
        await queryRunner.query(`CREATE TABLE "temporary_photos" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "department" varchar(20) NOT NULL, "format" varchar(10) NOT NULL, "bitDepth" integer NOT NULL, "width" integer NOT NULL, "height" integer NOT NULL, "previewWidth" integer NOT NULL, "previewHeight" integer NOT NULL, "fileBytes" integer NOT NULL, "iccProfile" varchar(200), "orientation" integer NOT NULL DEFAULT (1), "storageKey" varchar(64) NOT NULL, "originalName" varchar(200) NOT NULL DEFAULT (''), "isDemo" boolean NOT NULL DEFAULT (0), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "uploadedById" integer, CONSTRAINT "UQ_ce4d7204fe715dda244f3e21f8c" UNIQUE ("storageKey"), CONSTRAINT "FK_e3060444e21f83ac1659fea2be9" FOREIGN KEY ("productionId") REFERENCES "productions" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_555e65a79c560d678712a3aec1e" FOREIGN KEY ("uploadedById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`);
        await queryRunner.query(`INSERT INTO "temporary_photos"("id", "name", "notes", "department", "format", "bitDepth", "width", "height", "previewWidth", "previewHeight", "fileBytes", "iccProfile", "orientation", "storageKey", "originalName", "isDemo", "createdAt", "updatedAt", "productionId", "uploadedById") SELECT "id", "name", "notes", "department", "format", "bitDepth", "width", "height", "previewWidth", "previewHeight", "fileBytes", "iccProfile", "orientation", "storageKey", "originalName", "isDemo", "createdAt", "updatedAt", "productionId", "uploadedById" FROM "photos"`);
        await queryRunner.query(`DROP TABLE "photos"`);
        await queryRunner.query(`ALTER TABLE "temporary_photos" RENAME TO "photos"`);
        await queryRunner.query(`CREATE INDEX "IDX_5807a228543748486050119540" ON "photos" ("productionId", "createdAt") `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "IDX_5807a228543748486050119540"`);
        await queryRunner.query(`ALTER TABLE "photos" RENAME TO "temporary_photos"`);
        await queryRunner.query(`CREATE TABLE "photos" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "department" varchar(20) NOT NULL, "format" varchar(10) NOT NULL, "bitDepth" integer NOT NULL, "width" integer NOT NULL, "height" integer NOT NULL, "previewWidth" integer NOT NULL, "previewHeight" integer NOT NULL, "fileBytes" integer NOT NULL, "iccProfile" varchar(200), "orientation" integer NOT NULL DEFAULT (1), "storageKey" varchar(64) NOT NULL, "originalName" varchar(200) NOT NULL DEFAULT (''), "isDemo" boolean NOT NULL DEFAULT (0), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "uploadedById" integer, CONSTRAINT "UQ_ce4d7204fe715dda244f3e21f8c" UNIQUE ("storageKey"))`);
        await queryRunner.query(`INSERT INTO "photos"("id", "name", "notes", "department", "format", "bitDepth", "width", "height", "previewWidth", "previewHeight", "fileBytes", "iccProfile", "orientation", "storageKey", "originalName", "isDemo", "createdAt", "updatedAt", "productionId", "uploadedById") SELECT "id", "name", "notes", "department", "format", "bitDepth", "width", "height", "previewWidth", "previewHeight", "fileBytes", "iccProfile", "orientation", "storageKey", "originalName", "isDemo", "createdAt", "updatedAt", "productionId", "uploadedById" FROM "temporary_photos"`);
        await queryRunner.query(`DROP TABLE "temporary_photos"`);
        await queryRunner.query(`CREATE INDEX "IDX_5807a228543748486050119540" ON "photos" ("productionId", "createdAt") `);
        await queryRunner.query(`DROP INDEX "IDX_5807a228543748486050119540"`);
        await queryRunner.query(`DROP TABLE "photos"`);
    }

}
