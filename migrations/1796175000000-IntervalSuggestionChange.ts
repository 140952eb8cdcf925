import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Calibration events say which way their interval suggestion moves, so the
 * words shown are the suggestion's own. Open suggestions that moved against
 * the evidence (a policy limit clamped an out-of-range interval the wrong way)
 * are turned into what they are: outside the policy, the interval unchanged.
 */
export class IntervalSuggestionChange1796175000000 implements MigrationInterface {
    name = 'IntervalSuggestionChange1796175000000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "calibration_events"
            ADD "suggested_change" text
        `);
        await queryRunner.query(`
            UPDATE "calibration_events"
            SET "suggested_interval_months" = "interval_months",
                "suggestion_reason" = 'The earlier suggestion moved against the as-found result because the interval is outside the policy''s range: set the interval by hand.'
            WHERE "interval_decision" IS NULL
              AND (("as_found" = 'out_of_tolerance' AND "suggested_interval_months" > "interval_months")
                OR ("as_found" <> 'out_of_tolerance' AND "suggested_interval_months" < "interval_months"))
        `);
        await queryRunner.query(`
            UPDATE "calibration_events"
            SET "suggested_change" = CASE
                WHEN "suggestion_reason" LIKE 'The earlier suggestion moved against%' THEN 'outside_policy'
                WHEN "suggested_interval_months" > "interval_months" THEN 'lengthen'
                WHEN "suggested_interval_months" < "interval_months" THEN 'shorten'
                ELSE 'keep' END
        `);
        await queryRunner.query(`
            ALTER TABLE "calibration_events"
            ALTER COLUMN "suggested_change" SET NOT NULL
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "calibration_events" DROP COLUMN "suggested_change"
        `);
    }
}
