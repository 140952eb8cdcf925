import { MigrationInterface, QueryRunner } from "typeorm";

/** Indexes for GET /api/availability: walk a type's assets in display order and
 * probe each for an overlapping active booking, stopping at the limit. */
export class AvailabilityIndexes1796168900000 implements MigrationInterface {
    name = 'AvailabilityIndexes1796168900000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE INDEX "assets_availability_order" ON "assets" ("organization_id", "type", ("kit_id" IS NOT NULL), "asset_tag")`);
        await queryRunner.query(`CREATE INDEX "booking_items_active_by_asset" ON "booking_items" ("asset_id", "ends_on") INCLUDE ("starts_on") WHERE "active"`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "booking_items_active_by_asset"`);
        await queryRunner.query(`DROP INDEX "assets_availability_order"`);
    }
}
