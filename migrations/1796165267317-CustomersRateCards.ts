import { MigrationInterface, QueryRunner } from "typeorm";

/** Customers and rental rate cards (per asset type or per kit). */

export class CustomersRateCards1796165267317 implements MigrationInterface {
    name = 'CustomersRateCards1796165267317'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "customers" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "company" text NOT NULL,
                "billing_contact" text,
                "billing_email" text NOT NULL,
                "address" text,
                "tax_number" text,
                "notes" text,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_133ec679a801fab5e070f73d3ea" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_d2fc0e42b07d01fafc3fbb2bee" ON "customers" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_0838a8bafd89ebdca311d43fee" ON "customers" ("organization_id", "company")
        `);
        await queryRunner.query(`
            CREATE TABLE "rate_cards" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "asset_type" text,
                "kit_id" uuid,
                "day_minor" integer NOT NULL,
                "week_minor" integer NOT NULL,
                "month_minor" integer NOT NULL,
                "late_fee_per_day_minor" integer NOT NULL,
                CONSTRAINT "PK_54c4a5c4872b2339d848e5d9eb5" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_680988e8038801c833764359b6" ON "rate_cards" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_f5c5ff45e2eead382db8910036" ON "rate_cards" ("organization_id", "kit_id")
            WHERE "kit_id" IS NOT NULL
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_6b0d193031baf20a4cab7edd55" ON "rate_cards" ("organization_id", "asset_type")
            WHERE "asset_type" IS NOT NULL
        `);
        await queryRunner.query(`
            ALTER TABLE "customers"
            ADD CONSTRAINT "FK_d2fc0e42b07d01fafc3fbb2bee3" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "rate_cards"
            ADD CONSTRAINT "FK_680988e8038801c833764359b6f" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "rate_cards" DROP CONSTRAINT "FK_680988e8038801c833764359b6f"
        `);
        await queryRunner.query(`
            ALTER TABLE "customers" DROP CONSTRAINT "FK_d2fc0e42b07d01fafc3fbb2bee3"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_6b0d193031baf20a4cab7edd55"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_f5c5ff45e2eead382db8910036"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_680988e8038801c833764359b6"
        `);
        await queryRunner.query(`
            DROP TABLE "rate_cards"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_0838a8bafd89ebdca311d43fee"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_d2fc0e42b07d01fafc3fbb2bee"
        `);
        await queryRunner.query(`
            DROP TABLE "customers"
        `);
    }

}
