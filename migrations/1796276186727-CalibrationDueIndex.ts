import { MigrationInterface, QueryRunner } from "typeorm";

/** The calibration review reads only the items that need calibration, in due order (undated first), without touching
 * the rest of the fleet: the due list stops at its limit, the counts and the year's timeline are index-only scans. */
export class CalibrationDueIndex1796276186727 implements MigrationInterface {
    name = 'CalibrationDueIndex1796276186727'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE INDEX "assets_calibration_due" ON "assets" ("organization_id", (COALESCE("due_on", '-infinity'::date)), "asset_tag") INCLUDE ("due_on") WHERE "calibration_required" AND "status" <> 'retired'`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "assets_calibration_due"`);
    }
}
