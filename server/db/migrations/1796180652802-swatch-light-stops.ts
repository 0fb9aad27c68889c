import { MigrationInterface, QueryRunner } from "typeorm";

export class SwatchLightStops1796180652802 implements MigrationInterface {
    name = 'SwatchLightStops1796180652802'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "IDX_d2fd4db3e389c2509deeb28dc6"`);
        await queryRunner.query(`CREATE TABLE "temporary_swatches" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "department" varchar(20) NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "origin" text NOT NULL, "hex" varchar(7) NOT NULL, "reflectance" text, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer, "lightStops" real NOT NULL DEFAULT (0), CONSTRAINT "FK_64595bca54755f62c1994c758c2" FOREIGN KEY ("createdById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION, CONSTRAINT "FK_2e3f1e03040391ba6e467dc21b1" FOREIGN KEY ("productionId") REFERENCES "productions" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`);
        await queryRunner.query(`INSERT INTO "temporary_swatches"("id", "department", "name", "notes", "origin", "hex", "reflectance", "createdAt", "updatedAt", "productionId", "createdById") SELECT "id", "department", "name", "notes", "origin", "hex", "reflectance", "createdAt", "updatedAt", "productionId", "createdById" FROM "swatches"`);
        await queryRunner.query(`DROP TABLE "swatches"`);
        await queryRunner.query(`ALTER TABLE "temporary_swatches" RENAME TO "swatches"`);
        await queryRunner.query(`CREATE INDEX "IDX_d2fd4db3e389c2509deeb28dc6" ON "swatches" ("productionId", "department") `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "IDX_d2fd4db3e389c2509deeb28dc6"`);
        await queryRunner.query(`ALTER TABLE "swatches" RENAME TO "temporary_swatches"`);
        await queryRunner.query(`CREATE TABLE "swatches" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "department" varchar(20) NOT NULL, "name" varchar(120) NOT NULL, "notes" text NOT NULL DEFAULT (''), "origin" text NOT NULL, "hex" varchar(7) NOT NULL, "reflectance" text, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "productionId" integer NOT NULL, "createdById" integer, CONSTRAINT "FK_64595bca54755f62c1994c758c2" FOREIGN KEY ("createdById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION, CONSTRAINT "FK_2e3f1e03040391ba6e467dc21b1" FOREIGN KEY ("productionId") REFERENCES "productions" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`);
        await queryRunner.query(`INSERT INTO "swatches"("id", "department", "name", "notes", "origin", "hex", "reflectance", "createdAt", "updatedAt", "productionId", "createdById") SELECT "id", "department", "name", "notes", "origin", "hex", "reflectance", "createdAt", "updatedAt", "productionId", "createdById" FROM "temporary_swatches"`);
        await queryRunner.query(`DROP TABLE "temporary_swatches"`);
        await queryRunner.query(`CREATE INDEX "IDX_d2fd4db3e389c2509deeb28dc6" ON "swatches" ("productionId", "department") `);
    }

}
