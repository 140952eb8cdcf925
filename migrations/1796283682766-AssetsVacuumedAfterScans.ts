import { MigrationInterface, QueryRunner } from "typeorm";

/** The calibration review counts from an index alone only where the visibility map says the rows are all visible. The
 * daily due scan rewrites every item whose state changed (23,343 rows at 200,000 assets on a first scan): with the
 * default 20 % threshold autovacuum never came, and the year's timeline read the table again (133 ms instead of 23 ms).
 * One per cent brings the vacuum within a minute or two of a large scan. */
export class AssetsVacuumedAfterScans1796283682766 implements MigrationInterface {
    name = 'AssetsVacuumedAfterScans1796283682766'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "assets" SET (autovacuum_vacuum_scale_factor = 0.01, autovacuum_analyze_scale_factor = 0.02)`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "assets" RESET (autovacuum_vacuum_scale_factor, autovacuum_analyze_scale_factor)`);
    }
}
