import { MigrationInterface, QueryRunner } from "typeorm";

const SEARCH_TEXT = `lower(asset_tag || ' ' || serial_number || ' ' || coalesce(rfid_tag, '') || ' ' || coalesce(manufacturer, '') || ' ' || coalesce(model, '') || ' ' || coalesce(location, ''))`;

/** Case-insensitive fleet search through a trigram index on the lower-cased text
 * (`LIKE` on it can use the index; `ILIKE` on the mixed-case text could not be costed well). */
export class FleetSearchText1796162399952 implements MigrationInterface {
    name = 'FleetSearchText1796162399952'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "assets_search_trgm"`);
        await queryRunner.query(`CREATE INDEX "assets_search_lower_trgm" ON "assets" USING gin ((${SEARCH_TEXT}) gin_trgm_ops)`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "assets_search_lower_trgm"`);
        await queryRunner.query(`
            CREATE INDEX "assets_search_trgm" ON "assets" USING gin (
                (asset_tag || ' ' || serial_number || ' ' || coalesce(rfid_tag, '') || ' ' || coalesce(manufacturer, '') || ' ' || coalesce(model, '') || ' ' || coalesce(location, '')) gin_trgm_ops
            )
        `);
    }
}
