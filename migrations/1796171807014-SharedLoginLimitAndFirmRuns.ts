import { MigrationInterface, QueryRunner } from "typeorm";

export class SharedLoginLimitAndFirmRuns1796171807014 implements MigrationInterface {
    name = 'SharedLoginLimitAndFirmRuns1796171807014'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "login_attempts" (
                "key" text NOT NULL,
                "hits" integer NOT NULL,
                "resets_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                CONSTRAINT "PK_f90e70c50d5744e4d9f41dd397c" PRIMARY KEY ("key")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_be81306e531d73a97245aa5152" ON "login_attempts" ("resets_at")
        `);
        await queryRunner.query(`
            ALTER TABLE "job_runs"
            ADD "organization_id" uuid
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "job_runs" DROP COLUMN "organization_id"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_be81306e531d73a97245aa5152"
        `);
        await queryRunner.query(`
            DROP TABLE "login_attempts"
        `);
    }

}
