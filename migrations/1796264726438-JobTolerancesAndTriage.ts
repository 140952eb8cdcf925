import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * A job's tightest feature tolerance, the as-found error a certificate states,
 * and the triage a person accepted for each booking of an impact review (the
 * numbers and rule, kept for the auditor).
 */
export class JobTolerancesAndTriage1796264726438 implements MigrationInterface {
    name = 'JobTolerancesAndTriage1796264726438'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "jobs" ADD "tightest_tolerance" jsonb`);
        await queryRunner.query(`ALTER TABLE "calibration_events" ADD "as_found_error_um" double precision`);
        await queryRunner.query(`ALTER TABLE "impact_review_items" ADD "triage" jsonb`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "impact_review_items" DROP COLUMN "triage"`);
        await queryRunner.query(`ALTER TABLE "calibration_events" DROP COLUMN "as_found_error_um"`);
        await queryRunner.query(`ALTER TABLE "jobs" DROP COLUMN "tightest_tolerance"`);
    }
}
