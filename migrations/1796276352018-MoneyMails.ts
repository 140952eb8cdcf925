import { MigrationInterface, QueryRunner } from 'typeorm';

/** Billing's record of each capture, release, invoice and credit note the customer was mailed about, and its outbox message. */
export class MoneyMails1796276352018 implements MigrationInterface {
  name = 'MoneyMails1796276352018';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
            CREATE TABLE "money_mails" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "rental_id" uuid NOT NULL,
                "event" text NOT NULL,
                "outbox_message_id" uuid NOT NULL,
                "captured_minor" integer NOT NULL DEFAULT '0',
                "released_minor" integer NOT NULL DEFAULT '0',
                "charged_minor" integer NOT NULL DEFAULT '0',
                "document_number" text,
                "total_minor" integer,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_7813dc78ec7ced13ca3e1e29d4a" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`CREATE INDEX "IDX_48a35ca4bfb251a37a1c757c3c" ON "money_mails" ("organization_id")`);
    await queryRunner.query(`CREATE INDEX "IDX_107f7cd998ec768cf260f20a7c" ON "money_mails" ("organization_id", "rental_id")`);
    await queryRunner.query(
      `ALTER TABLE "money_mails" ADD CONSTRAINT "FK_48a35ca4bfb251a37a1c757c3ca" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "money_mails" ADD CONSTRAINT "FK_a5420793add043850876ff6470b" FOREIGN KEY ("rental_id") REFERENCES "rentals"("id") ON DELETE RESTRICT ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "money_mails" DROP CONSTRAINT "FK_a5420793add043850876ff6470b"`);
    await queryRunner.query(`ALTER TABLE "money_mails" DROP CONSTRAINT "FK_48a35ca4bfb251a37a1c757c3ca"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_107f7cd998ec768cf260f20a7c"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_48a35ca4bfb251a37a1c757c3c"`);
    await queryRunner.query(`DROP TABLE "money_mails"`);
  }
}
