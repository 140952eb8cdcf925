import { MigrationInterface, QueryRunner } from "typeorm";

const SEARCH_TEXT = (row: string) =>
  `lower(${row}.asset_tag || ' ' || ${row}.serial_number || ' ' || coalesce(${row}.rfid_tag, '') || ' ' || coalesce(${row}.manufacturer, '') || ' ' || coalesce(${row}.model, '') || ' ' || coalesce(${row}.location, ''))`;

/** The fleet search text as a stored column kept by a trigger: the trigram index's
 * recheck then reads it instead of rebuilding the text for every candidate row. */
export class FleetSearchColumn1796166100000 implements MigrationInterface {
    name = 'FleetSearchColumn1796166100000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "assets" ADD "search_text" text NOT NULL DEFAULT ''`);
        await queryRunner.query(`
            CREATE FUNCTION assets_set_search_text() RETURNS trigger LANGUAGE plpgsql AS $$
            BEGIN
                NEW.search_text := ${SEARCH_TEXT('NEW')};
                RETURN NEW;
            END $$
        `);
        await queryRunner.query(`CREATE TRIGGER assets_search_text BEFORE INSERT OR UPDATE ON "assets" FOR EACH ROW EXECUTE FUNCTION assets_set_search_text()`);
        await queryRunner.query(`UPDATE "assets" a SET search_text = ${SEARCH_TEXT('a')}`);
        await queryRunner.query(`DROP INDEX "assets_search_lower_trgm"`);
        await queryRunner.query(`CREATE INDEX "assets_search_text_trgm" ON "assets" USING gin (search_text gin_trgm_ops)`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "assets_search_text_trgm"`);
        await queryRunner.query(`CREATE INDEX "assets_search_lower_trgm" ON "assets" USING gin ((${SEARCH_TEXT('assets')}) gin_trgm_ops)`);
        await queryRunner.query(`DROP TRIGGER assets_search_text ON "assets"`);
        await queryRunner.query(`DROP FUNCTION assets_set_search_text()`);
        await queryRunner.query(`ALTER TABLE "assets" DROP COLUMN "search_text"`);
    }
}
