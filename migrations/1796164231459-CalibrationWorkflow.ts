import { MigrationInterface, QueryRunner } from "typeorm";

/** Calibration events with certificate files, lab trips, impact reviews, and the daily scan's last reported state per asset. */

export class CalibrationWorkflow1796164231459 implements MigrationInterface {
    name = 'CalibrationWorkflow1796164231459'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "certificate_files" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "file_name" text NOT NULL,
                "size_bytes" integer NOT NULL,
                "data" bytea NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_fcc740cda5d8688872ecd2bef64" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_cb964d5975205fa0288073474a" ON "certificate_files" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "calibration_events" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "asset_id" uuid NOT NULL,
                "performed_on" date NOT NULL,
                "provider" text NOT NULL,
                "certificate_number" text NOT NULL,
                "certificate_file_id" uuid NOT NULL,
                "as_found" text NOT NULL,
                "as_left" text NOT NULL,
                "interval_months" integer NOT NULL,
                "due_on" date NOT NULL,
                "suggested_interval_months" integer NOT NULL,
                "suggestion_reason" text NOT NULL,
                "interval_decision" text,
                "lab_trip_id" uuid,
                "note" text,
                "recorded_by" uuid NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_d7b123443962f907806bd16806e" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_e139e219040d42e7ba19f73a1e" ON "calibration_events" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_ff2f483b03bee005c039eeaa7f" ON "calibration_events" ("organization_id", "asset_id", "performed_on")
        `);
        await queryRunner.query(`
            CREATE TABLE "impact_reviews" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "asset_id" uuid NOT NULL,
                "trigger" text NOT NULL,
                "trigger_id" uuid NOT NULL,
                "since" date,
                "found_on" date NOT NULL,
                "state" text NOT NULL DEFAULT 'open',
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "closed_at" TIMESTAMP WITH TIME ZONE,
                CONSTRAINT "PK_fc6ac92cb9638e59a9047a7bf10" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_3c53a0940f367bb75a3b7004f7" ON "impact_reviews" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_75e32616c6cabaed7dace89928" ON "impact_reviews" ("organization_id", "asset_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_2df0e6999d052f9dd9ebfa77f0" ON "impact_reviews" ("organization_id", "state")
        `);
        await queryRunner.query(`
            CREATE TABLE "impact_review_items" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "review_id" uuid NOT NULL,
                "booking_id" uuid NOT NULL,
                "assessment" text,
                "note" text,
                "assessed_by" uuid,
                "assessed_at" TIMESTAMP WITH TIME ZONE,
                "notice_queued_at" TIMESTAMP WITH TIME ZONE,
                CONSTRAINT "PK_e6bfe83cde9b77f5b85be82a519" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_cc031483e48103874859ce1c3e" ON "impact_review_items" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_57c0f2d01bf8a425b7f0e8537e" ON "impact_review_items" ("review_id", "booking_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "lab_trips" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "provider" text NOT NULL,
                "sent_on" date NOT NULL,
                "expected_back_on" date NOT NULL,
                "state" text NOT NULL,
                "booking_id" uuid,
                "created_by" uuid NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_d2c2f37f2601d57c9328b60ccd6" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_1681c57d1faac0ee4c6b257c4d" ON "lab_trips" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_67008234878577501ec13e7044" ON "lab_trips" ("organization_id", "state")
        `);
        await queryRunner.query(`
            CREATE TABLE "lab_trip_items" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "lab_trip_id" uuid NOT NULL,
                "asset_id" uuid NOT NULL,
                "received_on" date,
                "calibration_event_id" uuid,
                CONSTRAINT "PK_c247282d947cc41db7a78775621" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_0e0d847cca4e2695d0507937b9" ON "lab_trip_items" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_17d61308bf979a3055ba91437b" ON "lab_trip_items" ("lab_trip_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_cb681ecbba8542518c075e9a13" ON "lab_trip_items" ("organization_id", "asset_id")
        `);
        await queryRunner.query(`
            ALTER TABLE "assets"
            ADD "notified_calibration_state" text
        `);
        await queryRunner.query(`
            ALTER TABLE "certificate_files"
            ADD CONSTRAINT "FK_cb964d5975205fa0288073474a0" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "calibration_events"
            ADD CONSTRAINT "FK_e139e219040d42e7ba19f73a1e0" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "calibration_events"
            ADD CONSTRAINT "FK_ead4322d8feb02de27117660451" FOREIGN KEY ("asset_id") REFERENCES "assets"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "calibration_events"
            ADD CONSTRAINT "FK_8e3548848299ee3071436c21bc6" FOREIGN KEY ("certificate_file_id") REFERENCES "certificate_files"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "impact_reviews"
            ADD CONSTRAINT "FK_3c53a0940f367bb75a3b7004f70" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "impact_reviews"
            ADD CONSTRAINT "FK_a9060fff12acc5b9b95407b5192" FOREIGN KEY ("asset_id") REFERENCES "assets"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "impact_review_items"
            ADD CONSTRAINT "FK_cc031483e48103874859ce1c3ef" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "impact_review_items"
            ADD CONSTRAINT "FK_4039af0b47d1cc92a4755584d9e" FOREIGN KEY ("review_id") REFERENCES "impact_reviews"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "lab_trips"
            ADD CONSTRAINT "FK_1681c57d1faac0ee4c6b257c4d1" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "lab_trip_items"
            ADD CONSTRAINT "FK_0e0d847cca4e2695d0507937b97" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "lab_trip_items"
            ADD CONSTRAINT "FK_17d61308bf979a3055ba91437bb" FOREIGN KEY ("lab_trip_id") REFERENCES "lab_trips"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "lab_trip_items"
            ADD CONSTRAINT "FK_6b3364349f3ec7e4138a23f1b72" FOREIGN KEY ("asset_id") REFERENCES "assets"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "lab_trip_items" DROP CONSTRAINT "FK_6b3364349f3ec7e4138a23f1b72"
        `);
        await queryRunner.query(`
            ALTER TABLE "lab_trip_items" DROP CONSTRAINT "FK_17d61308bf979a3055ba91437bb"
        `);
        await queryRunner.query(`
            ALTER TABLE "lab_trip_items" DROP CONSTRAINT "FK_0e0d847cca4e2695d0507937b97"
        `);
        await queryRunner.query(`
            ALTER TABLE "lab_trips" DROP CONSTRAINT "FK_1681c57d1faac0ee4c6b257c4d1"
        `);
        await queryRunner.query(`
            ALTER TABLE "impact_review_items" DROP CONSTRAINT "FK_4039af0b47d1cc92a4755584d9e"
        `);
        await queryRunner.query(`
            ALTER TABLE "impact_review_items" DROP CONSTRAINT "FK_cc031483e48103874859ce1c3ef"
        `);
        await queryRunner.query(`
            ALTER TABLE "impact_reviews" DROP CONSTRAINT "FK_a9060fff12acc5b9b95407b5192"
        `);
        await queryRunner.query(`
            ALTER TABLE "impact_reviews" DROP CONSTRAINT "FK_3c53a0940f367bb75a3b7004f70"
        `);
        await queryRunner.query(`
            ALTER TABLE "calibration_events" DROP CONSTRAINT "FK_8e3548848299ee3071436c21bc6"
        `);
        await queryRunner.query(`
            ALTER TABLE "calibration_events" DROP CONSTRAINT "FK_ead4322d8feb02de27117660451"
        `);
        await queryRunner.query(`
            ALTER TABLE "calibration_events" DROP CONSTRAINT "FK_e139e219040d42e7ba19f73a1e0"
        `);
        await queryRunner.query(`
            ALTER TABLE "certificate_files" DROP CONSTRAINT "FK_cb964d5975205fa0288073474a0"
        `);
        await queryRunner.query(`
            ALTER TABLE "assets" DROP COLUMN "notified_calibration_state"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_cb681ecbba8542518c075e9a13"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_17d61308bf979a3055ba91437b"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_0e0d847cca4e2695d0507937b9"
        `);
        await queryRunner.query(`
            DROP TABLE "lab_trip_items"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_67008234878577501ec13e7044"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_1681c57d1faac0ee4c6b257c4d"
        `);
        await queryRunner.query(`
            DROP TABLE "lab_trips"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_57c0f2d01bf8a425b7f0e8537e"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_cc031483e48103874859ce1c3e"
        `);
        await queryRunner.query(`
            DROP TABLE "impact_review_items"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_2df0e6999d052f9dd9ebfa77f0"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_75e32616c6cabaed7dace89928"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_3c53a0940f367bb75a3b7004f7"
        `);
        await queryRunner.query(`
            DROP TABLE "impact_reviews"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_ff2f483b03bee005c039eeaa7f"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_e139e219040d42e7ba19f73a1e"
        `);
        await queryRunner.query(`
            DROP TABLE "calibration_events"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_cb964d5975205fa0288073474a"
        `);
        await queryRunner.query(`
            DROP TABLE "certificate_files"
        `);
    }

}
