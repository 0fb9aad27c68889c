import { MigrationInterface, QueryRunner } from "typeorm";

export class BenchBoards1764628004000 implements MigrationInterface {
    name = 'BenchBoards1764628004000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE "curves" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "kind" varchar(12) NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "origin" text NOT NULL, "samples" text NOT NULL, "source" text NOT NULL DEFAULT (''), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer)`);
        await queryRunner.query(`CREATE INDEX "IDX_8d95f9a59cdd234753e020dc0c" ON "curves" ("productionId", "kind") `);
        await queryRunner.query(`CREATE TABLE "looks" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "light" text NOT NULL, "filters" text NOT NULL, "medium" text NOT NULL, "tone" text NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer)`);
        await queryRunner.query(`CREATE TABLE "swatches" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "department" varchar(20) NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "origin" text NOT NULL, "hex" varchar(7) NOT NULL, "reflectance" text, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer)`);
        await queryRunner.query(`CREATE INDEX "IDX_d2fd4db3e389c2509deeb28dc6" ON "swatches" ("productionId", "department") `);
        await queryRunner.query(`CREATE TABLE "boards" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "department" varchar(20) NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "lookIds" text NOT NULL, "mergeStops" real NOT NULL DEFAULT (0.3333333333333333), "mergeDeltaE" real NOT NULL DEFAULT (10), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer)`);
        await queryRunner.query(`CREATE TABLE "board_swatches" ("boardId" integer NOT NULL, "swatchId" integer NOT NULL, PRIMARY KEY ("boardId", "swatchId"))`);
        await queryRunner.query(`CREATE INDEX "IDX_00caa32e7f948d72ad2eb620bf" ON "board_swatches" ("boardId") `);
        await queryRunner.query(`CREATE INDEX "IDX_42950eaaab9e08db6779edc8f8" ON "board_swatches" ("swatchId") `);
        await queryRunner.query(`DROP INDEX "IDX_8d95f9a59cdd234753e020dc0c"`);
        await queryRunner.query(`CREATE TABLE "temporary_curves" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "kind" varchar(12) NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "origin" text NOT NULL, "samples" text NOT NULL, "source" text NOT NULL DEFAULT (''), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer, CONSTRAINT "FK_3f70bcc198c489c95411847ca82" FOREIGN KEY ("productionId") REFERENCES "productions" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_463ecf8812b14077e46b1548128" FOREIGN KEY ("createdById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`);
        await queryRunner.query(`INSERT INTO "temporary_curves"("id", "kind", "name", "notes", "origin", "samples", "source", "createdAt", "updatedAt", "productionId", "createdById") SELECT "id", "kind", "name", "notes", "origin", "samples", "source", "createdAt", "updatedAt", "productionId", "createdById" FROM "curves"`);
        await queryRunner.query(`DROP TABLE "curves"`);
        await queryRunner.query(`ALTER TABLE "temporary_curves" RENAME TO "curves"`);
        await queryRunner.query(`CREATE INDEX "IDX_8d95f9a59cdd234753e020dc0c" ON "curves" ("productionId", "kind") `);
        await queryRunner.query(`CREATE TABLE "temporary_looks" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "light" text NOT NULL, "filters" text NOT NULL, "medium" text NOT NULL, "tone" text NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer, CONSTRAINT "FK_b066f1e24ae3d8ff367a6360984" FOREIGN KEY ("productionId") REFERENCES "productions" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_4977867e88fb805c1de3a688a72" FOREIGN KEY ("createdById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`);
        await queryRunner.query(`INSERT INTO "temporary_looks"("id", "name", "notes", "light", "filters", "medium", "tone", "createdAt", "updatedAt", "productionId", "createdById") SELECT "id", "name", "notes", "light", "filters", "medium", "tone", "createdAt", "updatedAt", "productionId", "createdById" FROM "looks"`);
        await queryRunner.query(`DROP TABLE "looks"`);
        await queryRunner.query(`ALTER TABLE "temporary_looks" RENAME TO "looks"`);
        await queryRunner.query(`DROP INDEX "IDX_d2fd4db3e389c2509deeb28dc6"`);
        await queryRunner.query(`CREATE TABLE "temporary_swatches" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "department" varchar(20) NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "origin" text NOT NULL, "hex" varchar(7) NOT NULL, "reflectance" text, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer, CONSTRAINT "FK_2e3f1e03040391ba6e467dc21b1" FOREIGN KEY ("productionId") REFERENCES "productions" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_64595bca54755f62c1994c758c2" FOREIGN KEY ("createdById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`);
        await queryRunner.query(`INSERT INTO "temporary_swatches"("id", "department", "name", "notes", "origin", "hex", "reflectance", "createdAt", "updatedAt", "productionId", "createdById") SELECT "id", "department", "name", "notes", "origin", "hex", "reflectance", "createdAt", "updatedAt", "productionId", "createdById" FROM "swatches"`);
        await queryRunner.query(`DROP TABLE "swatches"`);
        await queryRunner.query(`ALTER TABLE "temporary_swatches" RENAME TO "swatches"`);
        await queryRunner.query(`CREATE INDEX "IDX_d2fd4db3e389c2509deeb28dc6" ON "swatches" ("productionId", "department") `);
        await queryRunner.query(`CREATE TABLE "temporary_boards" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "department" varchar(20) NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "lookIds" text NOT NULL, "mergeStops" real NOT NULL DEFAULT (0.3333333333333333), "mergeDeltaE" real NOT NULL DEFAULT (10), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer, CONSTRAINT "FK_a80acfce977c0799d0765507207" FOREIGN KEY ("productionId") REFERENCES "productions" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_b82b543934c5e662ec834e5ad48" FOREIGN KEY ("createdById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`);
        await queryRunner.query(`INSERT INTO "temporary_boards"("id", "department", "name", "notes", "lookIds", "mergeStops", "mergeDeltaE", "createdAt", "updatedAt", "productionId", "createdById") SELECT "id", "department", "name", "notes", "lookIds", "mergeStops", "mergeDeltaE", "createdAt", "updatedAt", "productionId", "createdById" FROM "boards"`);
        await queryRunner.query(`DROP TABLE "boards"`);
        await queryRunner.query(`ALTER TABLE "temporary_boards" RENAME TO "boards"`);
        await queryRunner.query(`DROP INDEX "IDX_00caa32e7f948d72ad2eb620bf"`);
        await queryRunner.query(`DROP INDEX "IDX_42950eaaab9e08db6779edc8f8"`);
        await queryRunner.query(`CREATE TABLE "temporary_board_swatches" ("boardId" integer NOT NULL, "swatchId" integer NOT NULL, CONSTRAINT "FK_00caa32e7f948d72ad2eb620bfb" FOREIGN KEY ("boardId") REFERENCES "boards" ("id") ON DELETE CASCADE ON UPDATE CASCADE, CONSTRAINT "FK_42950eaaab9e08db6779edc8f80" FOREIGN KEY ("swatchId") REFERENCES "swatches" ("id") ON DELETE CASCADE ON UPDATE CASCADE, PRIMARY KEY ("boardId", "swatchId"))`);
        await queryRunner.query(`INSERT INTO "temporary_board_swatches"("boardId", "swatchId") SELECT "boardId", "swatchId" FROM "board_swatches"`);
        await queryRunner.query(`DROP TABLE "board_swatches"`);
        await queryRunner.query(`ALTER TABLE "temporary_board_swatches" RENAME TO "board_swatches"`);
        await queryRunner.query(`CREATE INDEX "IDX_00caa32e7f948d72ad2eb620bf" ON "board_swatches" ("boardId") `);
        await queryRunner.query(`CREATE INDEX "IDX_42950eaaab9e08db6779edc8f8" ON "board_swatches" ("swatchId") `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "IDX_42950eaaab9e08db6779edc8f8"`);
        await queryRunner.query(`DROP INDEX "IDX_00caa32e7f948d72ad2eb620bf"`);
        await queryRunner.query(`ALTER TABLE "board_swatches" RENAME TO "temporary_board_swatches"`);
        await queryRunner.query(`CREATE TABLE "board_swatches" ("boardId" integer NOT NULL, "swatchId" integer NOT NULL, PRIMARY KEY ("boardId", "swatchId"))`);
        await queryRunner.query(`INSERT INTO "board_swatches"("boardId", "swatchId") SELECT "boardId", "swatchId" FROM "temporary_board_swatches"`);
        await queryRunner.query(`DROP TABLE "temporary_board_swatches"`);
        await queryRunner.query(`CREATE INDEX "IDX_42950eaaab9e08db6779edc8f8" ON "board_swatches" ("swatchId") `);
        await queryRunner.query(`CREATE INDEX "IDX_00caa32e7f948d72ad2eb620bf" ON "board_swatches" ("boardId") `);
        await queryRunner.query(`ALTER TABLE "boards" RENAME TO "temporary_boards"`);
        await queryRunner.query(`CREATE TABLE "boards" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "department" varchar(20) NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "lookIds" text NOT NULL, "mergeStops" real NOT NULL DEFAULT (0.3333333333333333), "mergeDeltaE" real NOT NULL DEFAULT (10), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer)`);
        await queryRunner.query(`INSERT INTO "boards"("id", "department", "name", "notes", "lookIds", "mergeStops", "mergeDeltaE", "createdAt", "updatedAt", "productionId", "createdById") SELECT "id", "department", "name", "notes", "lookIds", "mergeStops", "mergeDeltaE", "createdAt", "updatedAt", "productionId", "createdById" FROM "temporary_boards"`);
        await queryRunner.query(`DROP TABLE "temporary_boards"`);
        await queryRunner.query(`DROP INDEX "IDX_d2fd4db3e389c2509deeb28dc6"`);
        await queryRunner.query(`ALTER TABLE "swatches" RENAME TO "temporary_swatches"`);
        await queryRunner.query(`CREATE TABLE "swatches" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "department" varchar(20) NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "origin" text NOT NULL, "hex" varchar(7) NOT NULL, "reflectance" text, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer)`);
        await queryRunner.query(`INSERT INTO "swatches"("id", "department", "name", "notes", "origin", "hex", "reflectance", "createdAt", "updatedAt", "productionId", "createdById") SELECT "id", "department", "name", "notes", "origin", "hex", "reflectance", "createdAt", "updatedAt", "productionId", "createdById" FROM "temporary_swatches"`);
        await queryRunner.query(`DROP TABLE "temporary_swatches"`);
        await queryRunner.query(`CREATE INDEX "IDX_d2fd4db3e389c2509deeb28dc6" ON "swatches" ("productionId", "department") `);
        await queryRunner.query(`ALTER TABLE "looks" RENAME TO "temporary_looks"`);
        await queryRunner.query(`CREATE TABLE "looks" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "light" text NOT NULL, "filters" text NOT NULL, "medium" text NOT NULL, "tone" text NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer)`);
        await queryRunner.query(`INSERT INTO "looks"("id", "name", "notes", "light", "filters", "medium", "tone", "createdAt", "updatedAt", "productionId", "createdById") SELECT "id", "name", "notes", "light", "filters", "medium", "tone", "createdAt", "updatedAt", "productionId", "createdById" FROM "temporary_looks"`);
        await queryRunner.query(`DROP TABLE "temporary_looks"`);
        await queryRunner.query(`DROP INDEX "IDX_8d95f9a59cdd234753e020dc0c"`);
        await queryRunner.query(`ALTER TABLE "curves" RENAME TO "temporary_curves"`);
        await queryRunner.query(`CREATE TABLE "curves" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "kind" varchar(12) NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "origin" text NOT NULL, "samples" text NOT NULL, "source" text NOT NULL DEFAULT (''), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer)`);
        await queryRunner.query(`INSERT INTO "curves"("id", "kind", "name", "notes", "origin", "samples", "source", "createdAt", "updatedAt", "productionId", "createdById") SELECT "id", "kind", "name", "notes", "origin", "samples", "source", "createdAt", "updatedAt", "productionId", "createdById" FROM "temporary_curves"`);
        await queryRunner.query(`DROP TABLE "temporary_curves"`);
        await queryRunner.query(`CREATE INDEX "IDX_8d95f9a59cdd234753e020dc0c" ON "curves" ("productionId", "kind") `);
        await queryRunner.query(`DROP INDEX "IDX_42950eaaab9e08db6779edc8f8"`);
        await queryRunner.query(`DROP INDEX "IDX_00caa32e7f948d72ad2eb620bf"`);
        await queryRunner.query(`DROP TABLE "board_swatches"`);
        await queryRunner.query(`DROP TABLE "boards"`);
        await queryRunner.query(`DROP INDEX "IDX_d2fd4db3e389c2509deeb28dc6"`);
        await queryRunner.query(`DROP TABLE "swatches"`);
        await queryRunner.query(`DROP TABLE "looks"`);
        await queryRunner.query(`DROP INDEX "IDX_8d95f9a59cdd234753e020dc0c"`);
        await queryRunner.query(`DROP TABLE "curves"`);
    }

}
