import { MigrationInterface, QueryRunner } from "typeorm";

const SEARCH_TEXT = (row: string) =>
  `lower(${row}.asset_tag || ' ' || ${row}.serial_number || ' ' || coalesce(${row}.rfid_tag, '') || ' ' || coalesce(${row}.manufacturer, '') || ' ' || coalesce(${row}.model, '') || ' ' || coalesce(${row}.location, ''))`;
const SEARCH_KEY = (row: string) => `nk_search_key(${row}.asset_tag) || ' ' || nk_search_key(${row}.serial_number) || ' ' || nk_search_key(${row}.rfid_tag)`;

/**
 * Search that forgives how a tag is typed: tags, serials and RFID tags are also kept in a forgiving form
 * (shared/assets/search-key.ts: lower case, no separators, no leading zeros in a number), trigram-indexed,
 * so "tip 5" finds TIP-005 and an RFID tag matches without its colons, in either case, and by its tail.
 */
export class FleetForgivingSearch1796267089014 implements MigrationInterface {
    name = 'FleetForgivingSearch1796267089014'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE FUNCTION nk_search_key(t text) RETURNS text LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$
                SELECT regexp_replace(regexp_replace(lower(coalesce(t, '')), '[^a-z0-9]+', '', 'g'), '(^|[a-z])0+(?=[0-9])', '\\1', 'g')
            $$
        `);
        await queryRunner.query(`ALTER TABLE "assets" ADD "search_key" text NOT NULL DEFAULT ''`);
        await queryRunner.query(`
            CREATE OR REPLACE FUNCTION assets_set_search_text() RETURNS trigger LANGUAGE plpgsql AS $$
            BEGIN
                NEW.search_text := ${SEARCH_TEXT('NEW')};
                NEW.search_key := ${SEARCH_KEY('NEW')};
                RETURN NEW;
            END $$
        `);
        await queryRunner.query(`UPDATE "assets" a SET search_key = ${SEARCH_KEY('a')}`);
        await queryRunner.query(`CREATE INDEX "assets_search_key_trgm" ON "assets" USING gin (search_key gin_trgm_ops)`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "assets_search_key_trgm"`);
        await queryRunner.query(`
            CREATE OR REPLACE FUNCTION assets_set_search_text() RETURNS trigger LANGUAGE plpgsql AS $$
            BEGIN
                NEW.search_text := ${SEARCH_TEXT('NEW')};
                RETURN NEW;
            END $$
        `);
        await queryRunner.query(`ALTER TABLE "assets" DROP COLUMN "search_key"`);
        await queryRunner.query(`DROP FUNCTION nk_search_key(text)`);
    }
}
