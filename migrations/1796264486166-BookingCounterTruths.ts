import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Bookings say when they are past use the owner recorded (history), and why
 * kit went before its checkout window or late after it was not collected.
 */
export class BookingCounterTruths1796264486166 implements MigrationInterface {
    name = 'BookingCounterTruths1796264486166'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "bookings"
            ADD "history" boolean NOT NULL DEFAULT false
        `);
        await queryRunner.query(`
            ALTER TABLE "bookings"
            ADD "checkout_note" text
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "bookings" DROP COLUMN "checkout_note"
        `);
        await queryRunner.query(`
            ALTER TABLE "bookings" DROP COLUMN "history"
        `);
    }
}
