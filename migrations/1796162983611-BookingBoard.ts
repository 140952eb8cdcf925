import { MigrationInterface, QueryRunner } from "typeorm";

/** Jobs, bookings and their items, and calendar-feed tokens. The exclusion constraint
 * needs btree_gist for uuid equality inside a GiST index; it refuses double bookings under any race. */

export class BookingBoard1796162983611 implements MigrationInterface {
    name = 'BookingBoard1796162983611'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE EXTENSION IF NOT EXISTS btree_gist`);
        await queryRunner.query(`
            CREATE TABLE "jobs" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "reference" text NOT NULL,
                "customer_name" text NOT NULL,
                "contact_name" text,
                "contact_email" text,
                "site_address" text,
                "starts_on" date NOT NULL,
                "ends_on" date NOT NULL,
                "lead_technician_id" uuid,
                "notes" text,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_cf0a6c42b72fcc7f7c237def345" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_3d9a2080fffe3e2c3b72fd56df" ON "jobs" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_101cbe61702e509b29655b8da1" ON "jobs" ("organization_id", "reference")
        `);
        await queryRunner.query(`
            CREATE TABLE "bookings" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "starts_on" date NOT NULL,
                "ends_on" date NOT NULL,
                "state" text NOT NULL DEFAULT 'reserved',
                "purpose" text NOT NULL,
                "job_id" uuid,
                "rental_id" uuid,
                "kit_id" uuid,
                "note" text,
                "created_by" uuid NOT NULL,
                "checked_out_at" TIMESTAMP WITH TIME ZONE,
                "handed_over_by" uuid,
                "taken_by" text,
                "taken_by_user_id" uuid,
                "checkout_checklist" jsonb,
                "returned_at" TIMESTAMP WITH TIME ZONE,
                "received_by" uuid,
                "brought_back_by" text,
                "return_checklist" jsonb,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_bee6805982cc1e248e94ce94957" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_1b3f0fcfa5c68dffbfd47cbb10" ON "bookings" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_3d1078687021bb1fd65aac1a89" ON "bookings" ("organization_id", "state")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_02cb923683fd9691bf0e161f5d" ON "bookings" ("organization_id", "starts_on", "ends_on")
        `);
        await queryRunner.query(`
            CREATE TABLE "booking_items" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "booking_id" uuid NOT NULL,
                "asset_id" uuid NOT NULL,
                "starts_on" date NOT NULL,
                "ends_on" date NOT NULL,
                "active" boolean NOT NULL DEFAULT true,
                CONSTRAINT "booking_items_no_double_booking" EXCLUDE USING gist (
                    "asset_id" WITH =,
                    daterange("starts_on", "ends_on", '[]') WITH &&
                )
                WHERE ("active"),
                    CONSTRAINT "PK_53d863efb388346f9bee6ec6701" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_1cb063ec9d276291306dfce878" ON "booking_items" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_ef31cb9266b7deb19ad6084747" ON "booking_items" ("booking_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_e117dcf76e3ac4328ada60dfc7" ON "booking_items" ("organization_id", "asset_id", "starts_on")
        `);
        await queryRunner.query(`
            ALTER TABLE "users"
            ADD "calendar_token" text
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_179bb6d80901c3bf80e31b165d" ON "users" ("calendar_token")
        `);
        await queryRunner.query(`
            ALTER TABLE "jobs"
            ADD CONSTRAINT "FK_3d9a2080fffe3e2c3b72fd56df2" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "bookings"
            ADD CONSTRAINT "FK_1b3f0fcfa5c68dffbfd47cbb103" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "bookings"
            ADD CONSTRAINT "FK_163a3d631fdb02010c0f056562e" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "bookings"
            ADD CONSTRAINT "FK_e64886c11d7610d47dc8fed3b68" FOREIGN KEY ("kit_id") REFERENCES "kits"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "booking_items"
            ADD CONSTRAINT "FK_1cb063ec9d276291306dfce8780" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "booking_items"
            ADD CONSTRAINT "FK_ef31cb9266b7deb19ad60847479" FOREIGN KEY ("booking_id") REFERENCES "bookings"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "booking_items"
            ADD CONSTRAINT "FK_dea5924ebe09e77262035024354" FOREIGN KEY ("asset_id") REFERENCES "assets"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "booking_items" DROP CONSTRAINT "FK_dea5924ebe09e77262035024354"
        `);
        await queryRunner.query(`
            ALTER TABLE "booking_items" DROP CONSTRAINT "FK_ef31cb9266b7deb19ad60847479"
        `);
        await queryRunner.query(`
            ALTER TABLE "booking_items" DROP CONSTRAINT "FK_1cb063ec9d276291306dfce8780"
        `);
        await queryRunner.query(`
            ALTER TABLE "bookings" DROP CONSTRAINT "FK_e64886c11d7610d47dc8fed3b68"
        `);
        await queryRunner.query(`
            ALTER TABLE "bookings" DROP CONSTRAINT "FK_163a3d631fdb02010c0f056562e"
        `);
        await queryRunner.query(`
            ALTER TABLE "bookings" DROP CONSTRAINT "FK_1b3f0fcfa5c68dffbfd47cbb103"
        `);
        await queryRunner.query(`
            ALTER TABLE "jobs" DROP CONSTRAINT "FK_3d9a2080fffe3e2c3b72fd56df2"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_179bb6d80901c3bf80e31b165d"
        `);
        await queryRunner.query(`
            ALTER TABLE "users" DROP COLUMN "calendar_token"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_e117dcf76e3ac4328ada60dfc7"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_ef31cb9266b7deb19ad6084747"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_1cb063ec9d276291306dfce878"
        `);
        await queryRunner.query(`
            DROP TABLE "booking_items"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_02cb923683fd9691bf0e161f5d"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_3d1078687021bb1fd65aac1a89"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_1b3f0fcfa5c68dffbfd47cbb10"
        `);
        await queryRunner.query(`
            DROP TABLE "bookings"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_101cbe61702e509b29655b8da1"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_3d9a2080fffe3e2c3b72fd56df"
        `);
        await queryRunner.query(`
            DROP TABLE "jobs"
        `);
    }

}
