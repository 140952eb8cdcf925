import { MigrationInterface, QueryRunner } from "typeorm";

export class InvoicePayments1796174263330 implements MigrationInterface {
    name = 'InvoicePayments1796174263330'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "invoice_payments" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "invoice_id" uuid NOT NULL,
                "amount_minor" integer NOT NULL,
                "received_on" date NOT NULL,
                "reference" text NOT NULL,
                "recorded_by" uuid NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_e19c9ebfa432289f510de7b4e99" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_0a957fc9de9c0868ad2cc33f98" ON "invoice_payments" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_7612b0cea75b644fc8d0c86c68" ON "invoice_payments" ("organization_id", "invoice_id")
        `);
        await queryRunner.query(`
            ALTER TABLE "invoice_payments"
            ADD CONSTRAINT "FK_0a957fc9de9c0868ad2cc33f989" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "invoice_payments"
            ADD CONSTRAINT "FK_e94fa427d3da279450dba6f4aa6" FOREIGN KEY ("invoice_id") REFERENCES "invoices"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        // Payments received are never edited or removed; a mistake is a credit note or a refund, on record.
        await queryRunner.query(`
            CREATE TRIGGER invoice_payments_append_only BEFORE UPDATE OR DELETE OR TRUNCATE ON "invoice_payments"
            FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_to_append_only()
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP TRIGGER invoice_payments_append_only ON "invoice_payments"`);
        await queryRunner.query(`
            ALTER TABLE "invoice_payments" DROP CONSTRAINT "FK_e94fa427d3da279450dba6f4aa6"
        `);
        await queryRunner.query(`
            ALTER TABLE "invoice_payments" DROP CONSTRAINT "FK_0a957fc9de9c0868ad2cc33f989"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_7612b0cea75b644fc8d0c86c68"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_0a957fc9de9c0868ad2cc33f98"
        `);
        await queryRunner.query(`
            DROP TABLE "invoice_payments"
        `);
    }

}
