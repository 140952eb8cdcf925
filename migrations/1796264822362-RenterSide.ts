import { MigrationInterface, QueryRunner } from "typeorm";

export class RenterSide1796264822362 implements MigrationInterface {
    name = 'RenterSide1796264822362'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "deposit_requests" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "rental_id" uuid NOT NULL,
                "checkout_session_id" text NOT NULL,
                "url" text NOT NULL,
                "expires_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "state" text NOT NULL,
                "idempotency_key" text NOT NULL,
                "sent_to" text NOT NULL,
                "decline_message" text,
                "requested_by" uuid NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_5474ff41b8c5aca99ac263e9b57" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_5bd427ebbca02a86499577014b" ON "deposit_requests" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_30f490e6d99b8ad6ba93cf1916" ON "deposit_requests" ("checkout_session_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_6ce5404d780520a05c51fc1dfc" ON "deposit_requests" ("idempotency_key")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_440f2fa76a048b2fd6015ac6e7" ON "deposit_requests" ("organization_id", "rental_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "renter_links" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "rental_id" uuid NOT NULL,
                "token_sha256" text NOT NULL,
                "expires_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "revoked_at" TIMESTAMP WITH TIME ZONE,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_857cd03c46be4094c06fc6694fa" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_570de8910d775676af06b975f3" ON "renter_links" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_76aa9fae0759cac47a73cab920" ON "renter_links" ("token_sha256")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_03086c68df9f8bf85e50565eba" ON "renter_links" ("organization_id", "rental_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "agreement_acceptances" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "rental_id" uuid NOT NULL,
                "renter_link_id" uuid NOT NULL,
                "full_name" text NOT NULL,
                "ip_address" text NOT NULL,
                "user_agent" text,
                "agreement_sha256" text NOT NULL,
                "agreement_pdf" bytea NOT NULL,
                "accepted_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_aaf5c4915248797f6cba55ea9e7" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_ae7c58bcb308e4fd3e88b45eb8" ON "agreement_acceptances" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_390f86b639d96a9a07735cfaad" ON "agreement_acceptances" ("organization_id", "rental_id")
        `);
        await queryRunner.query(`
            ALTER TABLE "rentals"
            ADD "handover_override_reason" text
        `);
        await queryRunner.query(`
            ALTER TABLE "rentals"
            ADD "handover_override_by" uuid
        `);
        await queryRunner.query(`
            ALTER TABLE "rentals"
            ADD "handover_override_at" TIMESTAMP WITH TIME ZONE
        `);
        await queryRunner.query(`
            ALTER TABLE "deposit_requests"
            ADD CONSTRAINT "FK_5bd427ebbca02a86499577014bf" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "deposit_requests"
            ADD CONSTRAINT "FK_e9055477bcbf50a5320d8d2a571" FOREIGN KEY ("rental_id") REFERENCES "rentals"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "renter_links"
            ADD CONSTRAINT "FK_570de8910d775676af06b975f39" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "renter_links"
            ADD CONSTRAINT "FK_6ef8949f438354e4db5c6d6cbeb" FOREIGN KEY ("rental_id") REFERENCES "rentals"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "agreement_acceptances"
            ADD CONSTRAINT "FK_ae7c58bcb308e4fd3e88b45eb86" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "agreement_acceptances"
            ADD CONSTRAINT "FK_47f906e218c7c63b74881a267eb" FOREIGN KEY ("rental_id") REFERENCES "rentals"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "agreement_acceptances"
            ADD CONSTRAINT "FK_aa990f2cfad406e2740dc356f92" FOREIGN KEY ("renter_link_id") REFERENCES "renter_links"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "agreement_acceptances" DROP CONSTRAINT "FK_aa990f2cfad406e2740dc356f92"
        `);
        await queryRunner.query(`
            ALTER TABLE "agreement_acceptances" DROP CONSTRAINT "FK_47f906e218c7c63b74881a267eb"
        `);
        await queryRunner.query(`
            ALTER TABLE "agreement_acceptances" DROP CONSTRAINT "FK_ae7c58bcb308e4fd3e88b45eb86"
        `);
        await queryRunner.query(`
            ALTER TABLE "renter_links" DROP CONSTRAINT "FK_6ef8949f438354e4db5c6d6cbeb"
        `);
        await queryRunner.query(`
            ALTER TABLE "renter_links" DROP CONSTRAINT "FK_570de8910d775676af06b975f39"
        `);
        await queryRunner.query(`
            ALTER TABLE "deposit_requests" DROP CONSTRAINT "FK_e9055477bcbf50a5320d8d2a571"
        `);
        await queryRunner.query(`
            ALTER TABLE "deposit_requests" DROP CONSTRAINT "FK_5bd427ebbca02a86499577014bf"
        `);
        await queryRunner.query(`
            ALTER TABLE "rentals" DROP COLUMN "handover_override_at"
        `);
        await queryRunner.query(`
            ALTER TABLE "rentals" DROP COLUMN "handover_override_by"
        `);
        await queryRunner.query(`
            ALTER TABLE "rentals" DROP COLUMN "handover_override_reason"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_390f86b639d96a9a07735cfaad"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_ae7c58bcb308e4fd3e88b45eb8"
        `);
        await queryRunner.query(`
            DROP TABLE "agreement_acceptances"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_03086c68df9f8bf85e50565eba"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_76aa9fae0759cac47a73cab920"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_570de8910d775676af06b975f3"
        `);
        await queryRunner.query(`
            DROP TABLE "renter_links"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_440f2fa76a048b2fd6015ac6e7"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_6ce5404d780520a05c51fc1dfc"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_30f490e6d99b8ad6ba93cf1916"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_5bd427ebbca02a86499577014b"
        `);
        await queryRunner.query(`
            DROP TABLE "deposit_requests"
        `);
    }

}
