import { MigrationInterface, QueryRunner } from "typeorm";

export class InvoiceIssuer1796173962598 implements MigrationInterface {
    name = 'InvoiceIssuer1796173962598'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "invoices"
            ADD "issuer" jsonb
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "invoices" DROP COLUMN "issuer"
        `);
    }

}
