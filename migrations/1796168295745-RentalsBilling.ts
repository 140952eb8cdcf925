import { MigrationInterface, QueryRunner } from "typeorm";

export class RentalsBilling1796168295745 implements MigrationInterface {
    name = 'RentalsBilling1796168295745'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "rentals" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "number" text NOT NULL,
                "customer_id" uuid NOT NULL,
                "booking_id" uuid NOT NULL,
                "quote" jsonb NOT NULL,
                "deposit_minor" integer NOT NULL,
                "currency" text NOT NULL,
                "payment_method_id" text,
                "note" text,
                "created_by" uuid NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_2b10d04c95a8bfe85b506ba52ba" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_08e5fdbf19647252665364cc8c" ON "rentals" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_6ef3fe3456b0365c5310b7d314" ON "rentals" ("booking_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_65a8f42cdf34ee04944389e3a6" ON "rentals" ("organization_id", "customer_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_1c566a40e66620a3248eae39a8" ON "rentals" ("organization_id", "number")
        `);
        await queryRunner.query(`
            CREATE TABLE "deposit_holds" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "rental_id" uuid NOT NULL,
                "kind" text NOT NULL DEFAULT 'hold',
                "payment_intent_id" text,
                "idempotency_key" text NOT NULL,
                "state" text NOT NULL,
                "amount_minor" integer NOT NULL,
                "captured_minor" integer NOT NULL DEFAULT '0',
                "card_brand" text,
                "card_last4" text,
                "capture_before" TIMESTAMP WITH TIME ZONE,
                "initiated_by" text NOT NULL,
                "failure_message" text,
                "capture_reason" text,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "settled_at" TIMESTAMP WITH TIME ZONE,
                CONSTRAINT "PK_957812c816182760cf8243ebad9" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_5ecdcd70eed5b31c321726f548" ON "deposit_holds" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_7f90e2ea012da8511360a7082f" ON "deposit_holds" ("payment_intent_id")
            WHERE "payment_intent_id" IS NOT NULL
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_387aa9309bab6dd24ac56d326f" ON "deposit_holds" ("idempotency_key")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_2a73a88fffa3dbc5f68bc2aca7" ON "deposit_holds" ("state", "capture_before")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_8a7ff8d1bb76ecb603d512238b" ON "deposit_holds" ("organization_id", "rental_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "invoices" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "kind" text NOT NULL,
                "number" text NOT NULL,
                "rental_id" uuid NOT NULL,
                "customer_id" uuid NOT NULL,
                "corrects_invoice_id" uuid,
                "issued_on" date NOT NULL,
                "issued_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "issued_by" uuid NOT NULL,
                "currency" text NOT NULL,
                "lines" jsonb NOT NULL,
                "subtotal_minor" integer NOT NULL,
                "tax_rate_basis_points" integer NOT NULL,
                "tax_minor" integer NOT NULL,
                "total_minor" integer NOT NULL,
                "deposit_captured_minor" integer NOT NULL,
                "card_charged_minor" integer NOT NULL,
                "balance_minor" integer NOT NULL,
                "customer" jsonb NOT NULL,
                "reason" text,
                CONSTRAINT "PK_668cef7c22a427fd822cc1be3ce" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_d4e095bcd100de447d3c27708f" ON "invoices" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_5e50e930c3f33bbf192df0a88a" ON "invoices" ("organization_id", "issued_at")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_2e0eece4c94da3fec9c967004e" ON "invoices" ("rental_id")
            WHERE "kind" = 'invoice'
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_ab92e1666cb1b3870198cb92ab" ON "invoices" ("organization_id", "number")
        `);
        await queryRunner.query(`
            CREATE TABLE "document_counters" (
                "organization_id" uuid NOT NULL,
                "series" text NOT NULL,
                "last_number" integer NOT NULL,
                CONSTRAINT "PK_dbde4ffb1f365ec415acc328910" PRIMARY KEY ("organization_id", "series")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "payment_events" (
                "event_id" text NOT NULL,
                "type" text NOT NULL,
                "organization_id" uuid,
                "outcome" text NOT NULL,
                "received_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_4f36a430ea944f1d250f0500d13" PRIMARY KEY ("event_id")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "outbox_attachments" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "message_id" uuid NOT NULL,
                "file_name" text NOT NULL,
                "content_type" text NOT NULL,
                "content" bytea NOT NULL,
                CONSTRAINT "PK_fa93c8b7ade7abba1adf94a30b2" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_8877a3359ef6310ec1c944f1de" ON "outbox_attachments" ("message_id")
        `);
        await queryRunner.query(`
            ALTER TABLE "customers"
            ADD "payment_customer_id" text
        `);
        await queryRunner.query(`
            ALTER TABLE "mail_sink_messages"
            ADD "attachments" jsonb
        `);
        await queryRunner.query(`
            ALTER TABLE "rentals"
            ADD CONSTRAINT "FK_08e5fdbf19647252665364cc8c8" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "rentals"
            ADD CONSTRAINT "FK_2e144b6f536b4fbad3c01bee620" FOREIGN KEY ("customer_id") REFERENCES "customers"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "rentals"
            ADD CONSTRAINT "FK_6ef3fe3456b0365c5310b7d314d" FOREIGN KEY ("booking_id") REFERENCES "bookings"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "deposit_holds"
            ADD CONSTRAINT "FK_5ecdcd70eed5b31c321726f5483" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "deposit_holds"
            ADD CONSTRAINT "FK_abd1ece31f53665f821b8464645" FOREIGN KEY ("rental_id") REFERENCES "rentals"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "invoices"
            ADD CONSTRAINT "FK_d4e095bcd100de447d3c27708f9" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "invoices"
            ADD CONSTRAINT "FK_24fd6cae7da64618edc198a106d" FOREIGN KEY ("rental_id") REFERENCES "rentals"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "invoices"
            ADD CONSTRAINT "FK_65e3145f317bd655481d3f96c74" FOREIGN KEY ("customer_id") REFERENCES "customers"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "invoices"
            ADD CONSTRAINT "FK_c7b589d4d30ca930fed71b8e4aa" FOREIGN KEY ("corrects_invoice_id") REFERENCES "invoices"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "outbox_attachments"
            ADD CONSTRAINT "FK_8877a3359ef6310ec1c944f1def" FOREIGN KEY ("message_id") REFERENCES "outbox_messages"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        // Issued invoices and credit notes are never edited or removed (corrections are credit notes).
        await queryRunner.query(`
            CREATE TRIGGER invoices_append_only BEFORE UPDATE OR DELETE OR TRUNCATE ON "invoices"
            FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_to_append_only()
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP TRIGGER invoices_append_only ON "invoices"`);
        await queryRunner.query(`
            ALTER TABLE "outbox_attachments" DROP CONSTRAINT "FK_8877a3359ef6310ec1c944f1def"
        `);
        await queryRunner.query(`
            ALTER TABLE "invoices" DROP CONSTRAINT "FK_c7b589d4d30ca930fed71b8e4aa"
        `);
        await queryRunner.query(`
            ALTER TABLE "invoices" DROP CONSTRAINT "FK_65e3145f317bd655481d3f96c74"
        `);
        await queryRunner.query(`
            ALTER TABLE "invoices" DROP CONSTRAINT "FK_24fd6cae7da64618edc198a106d"
        `);
        await queryRunner.query(`
            ALTER TABLE "invoices" DROP CONSTRAINT "FK_d4e095bcd100de447d3c27708f9"
        `);
        await queryRunner.query(`
            ALTER TABLE "deposit_holds" DROP CONSTRAINT "FK_abd1ece31f53665f821b8464645"
        `);
        await queryRunner.query(`
            ALTER TABLE "deposit_holds" DROP CONSTRAINT "FK_5ecdcd70eed5b31c321726f5483"
        `);
        await queryRunner.query(`
            ALTER TABLE "rentals" DROP CONSTRAINT "FK_6ef3fe3456b0365c5310b7d314d"
        `);
        await queryRunner.query(`
            ALTER TABLE "rentals" DROP CONSTRAINT "FK_2e144b6f536b4fbad3c01bee620"
        `);
        await queryRunner.query(`
            ALTER TABLE "rentals" DROP CONSTRAINT "FK_08e5fdbf19647252665364cc8c8"
        `);
        await queryRunner.query(`
            ALTER TABLE "mail_sink_messages" DROP COLUMN "attachments"
        `);
        await queryRunner.query(`
            ALTER TABLE "customers" DROP COLUMN "payment_customer_id"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_8877a3359ef6310ec1c944f1de"
        `);
        await queryRunner.query(`
            DROP TABLE "outbox_attachments"
        `);
        await queryRunner.query(`
            DROP TABLE "payment_events"
        `);
        await queryRunner.query(`
            DROP TABLE "document_counters"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_ab92e1666cb1b3870198cb92ab"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_2e0eece4c94da3fec9c967004e"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_5e50e930c3f33bbf192df0a88a"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_d4e095bcd100de447d3c27708f"
        `);
        await queryRunner.query(`
            DROP TABLE "invoices"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_8a7ff8d1bb76ecb603d512238b"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_2a73a88fffa3dbc5f68bc2aca7"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_387aa9309bab6dd24ac56d326f"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_7f90e2ea012da8511360a7082f"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_5ecdcd70eed5b31c321726f548"
        `);
        await queryRunner.query(`
            DROP TABLE "deposit_holds"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_1c566a40e66620a3248eae39a8"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_65a8f42cdf34ee04944389e3a6"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_6ef3fe3456b0365c5310b7d314"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_08e5fdbf19647252665364cc8c"
        `);
        await queryRunner.query(`
            DROP TABLE "rentals"
        `);
    }

}
