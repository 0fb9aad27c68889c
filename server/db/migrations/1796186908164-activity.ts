import { MigrationInterface, QueryRunner } from "typeorm";

/** The production's activity log (server/db/entities/activity.entity.ts); issue 14 item 7. */
export class Activity1796186908164 implements MigrationInterface {
    name = 'Activity1796186908164'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE "activity" ("id" integer PRIMARY KEY AUTOINCREMENT NOT NULL, "actorName" varchar(120) NOT NULL, "action" varchar(20) NOT NULL, "kind" varchar(20) NOT NULL, "itemId" integer, "itemName" varchar(254) NOT NULL, "detail" varchar(500) NOT NULL DEFAULT (''), "at" datetime NOT NULL, "productionId" integer NOT NULL, "actorId" integer, CONSTRAINT "FK_6b2b86f92c0170b8a6a3aa27e70" FOREIGN KEY ("productionId") REFERENCES "productions" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_52ea3a7ddc66851abf6138892bc" FOREIGN KEY ("actorId") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`);
        await queryRunner.query(`CREATE INDEX "IDX_5da91552cf0a09be01d062dab0" ON "activity" ("productionId", "id") `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "IDX_5da91552cf0a09be01d062dab0"`);
        await queryRunner.query(`DROP TABLE "activity"`);
    }

}
