import { MigrationInterface, QueryRunner } from "typeorm";

/** An incident opened at return names the customer of the job or rental it came back from. */
export class IncidentCustomer1796270437595 implements MigrationInterface {
    name = 'IncidentCustomer1796270437595'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "incidents" ADD "customer_name" text`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "incidents" DROP COLUMN "customer_name"`);
    }
}
