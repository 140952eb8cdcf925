import { MigrationInterface, QueryRunner } from "typeorm";

/** Field checks, holds (one open hold per asset), incidents with photos, and per-asset tolerance overrides. */

export class ChecksIncidentsHolds1796162783435 implements MigrationInterface {
    name = 'ChecksIncidentsHolds1796162783435'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "field_checks" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "kind" text NOT NULL,
                "asset_id" uuid NOT NULL,
                "related_asset_id" uuid,
                "position" text,
                "inputs" jsonb NOT NULL,
                "result" jsonb NOT NULL,
                "tolerance_um" double precision NOT NULL,
                "expanded_uncertainty_um" double precision NOT NULL,
                "guard_band_um" double precision NOT NULL,
                "decision_rule" text NOT NULL,
                "decision" text NOT NULL,
                "performed_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "performed_by" uuid NOT NULL,
                "note" text,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_d65b7069de77be1825522fde1f7" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_58d6ed8002904adfe306ffd042" ON "field_checks" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_92e0dfd5840655e0556aafc159" ON "field_checks" (
                "organization_id",
                "asset_id",
                "kind",
                "performed_at"
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "holds" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "asset_id" uuid NOT NULL,
                "reason" text NOT NULL,
                "summary" text NOT NULL,
                "incident_id" uuid,
                "check_id" uuid,
                "started_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "started_by" uuid NOT NULL,
                "released_at" TIMESTAMP WITH TIME ZONE,
                "released_by" uuid,
                "release_evidence" jsonb,
                CONSTRAINT "PK_a8a21700a256e0267fb43f4f7ae" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_ec71d5dece059a31ea30e07fb7" ON "holds" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_d31539d44ae6da899ef573b682" ON "holds" ("organization_id", "asset_id")
            WHERE "released_at" IS NULL
        `);
        await queryRunner.query(`
            CREATE TABLE "incidents" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "asset_id" uuid NOT NULL,
                "kind" text NOT NULL,
                "description" text NOT NULL,
                "occurred_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "location" text,
                "booking_id" uuid,
                "state" text NOT NULL DEFAULT 'reported',
                "resolution" text,
                "charge_amount_minor" integer,
                "reported_by" uuid NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_ccb34c01719889017e2246469f9" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_fbabc7192bfdb38bb6c2d0f777" ON "incidents" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_acb77896d4471f096c663c7e29" ON "incidents" ("organization_id", "asset_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_70f1a7792e9234f3d39d98d0c2" ON "incidents" ("organization_id", "state")
        `);
        await queryRunner.query(`
            CREATE TABLE "incident_photos" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "incident_id" uuid NOT NULL,
                "content_type" text NOT NULL,
                "file_name" text NOT NULL,
                "size_bytes" integer NOT NULL,
                "data" bytea NOT NULL,
                "thumbnail" bytea,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_e8a2eb0e1bdb4d7e4a5701412cf" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_996f6031b56e77127e223364f4" ON "incident_photos" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_b1645cc61d07f1600569150d24" ON "incident_photos" ("incident_id")
        `);
        await queryRunner.query(`
            ALTER TABLE "assets"
            ADD "tolerance_overrides" jsonb
        `);
        await queryRunner.query(`
            ALTER TABLE "field_checks"
            ADD CONSTRAINT "FK_58d6ed8002904adfe306ffd042d" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "field_checks"
            ADD CONSTRAINT "FK_83825f5a57f38165f36c73dc40c" FOREIGN KEY ("asset_id") REFERENCES "assets"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "field_checks"
            ADD CONSTRAINT "FK_68e06c94e46fa487e078c9f3dc8" FOREIGN KEY ("related_asset_id") REFERENCES "assets"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "holds"
            ADD CONSTRAINT "FK_ec71d5dece059a31ea30e07fb7a" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "holds"
            ADD CONSTRAINT "FK_3e4f74a625fbc1cb0cadc146998" FOREIGN KEY ("asset_id") REFERENCES "assets"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "incidents"
            ADD CONSTRAINT "FK_fbabc7192bfdb38bb6c2d0f7775" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "incidents"
            ADD CONSTRAINT "FK_0856337e6fbbb99d158dc135d52" FOREIGN KEY ("asset_id") REFERENCES "assets"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "incident_photos"
            ADD CONSTRAINT "FK_996f6031b56e77127e223364f47" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "incident_photos"
            ADD CONSTRAINT "FK_b1645cc61d07f1600569150d24f" FOREIGN KEY ("incident_id") REFERENCES "incidents"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "incident_photos" DROP CONSTRAINT "FK_b1645cc61d07f1600569150d24f"
        `);
        await queryRunner.query(`
            ALTER TABLE "incident_photos" DROP CONSTRAINT "FK_996f6031b56e77127e223364f47"
        `);
        await queryRunner.query(`
            ALTER TABLE "incidents" DROP CONSTRAINT "FK_0856337e6fbbb99d158dc135d52"
        `);
        await queryRunner.query(`
            ALTER TABLE "incidents" DROP CONSTRAINT "FK_fbabc7192bfdb38bb6c2d0f7775"
        `);
        await queryRunner.query(`
            ALTER TABLE "holds" DROP CONSTRAINT "FK_3e4f74a625fbc1cb0cadc146998"
        `);
        await queryRunner.query(`
            ALTER TABLE "holds" DROP CONSTRAINT "FK_ec71d5dece059a31ea30e07fb7a"
        `);
        await queryRunner.query(`
            ALTER TABLE "field_checks" DROP CONSTRAINT "FK_68e06c94e46fa487e078c9f3dc8"
        `);
        await queryRunner.query(`
            ALTER TABLE "field_checks" DROP CONSTRAINT "FK_83825f5a57f38165f36c73dc40c"
        `);
        await queryRunner.query(`
            ALTER TABLE "field_checks" DROP CONSTRAINT "FK_58d6ed8002904adfe306ffd042d"
        `);
        await queryRunner.query(`
            ALTER TABLE "assets" DROP COLUMN "tolerance_overrides"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_b1645cc61d07f1600569150d24"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_996f6031b56e77127e223364f4"
        `);
        await queryRunner.query(`
            DROP TABLE "incident_photos"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_70f1a7792e9234f3d39d98d0c2"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_acb77896d4471f096c663c7e29"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_fbabc7192bfdb38bb6c2d0f777"
        `);
        await queryRunner.query(`
            DROP TABLE "incidents"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_d31539d44ae6da899ef573b682"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_ec71d5dece059a31ea30e07fb7"
        `);
        await queryRunner.query(`
            DROP TABLE "holds"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_92e0dfd5840655e0556aafc159"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_58d6ed8002904adfe306ffd042"
        `);
        await queryRunner.query(`
            DROP TABLE "field_checks"
        `);
    }

}
