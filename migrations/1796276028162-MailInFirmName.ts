import type { MigrationInterface, QueryRunner } from 'typeorm';

export class MailInFirmName1796276028162 implements MigrationInterface {
  name = 'MailInFirmName1796276028162';

  public async up(queryRunner: QueryRunner): Promise<void> {
    // Mail goes out in the firm's name with its Reply-To as they were when it was queued.
    await queryRunner.query(`ALTER TABLE "outbox_messages" ADD "from_name" text NOT NULL DEFAULT ''`);
    await queryRunner.query(`ALTER TABLE "outbox_messages" ADD "reply_to" text`);
    // The customer notice a booking's customer was sent, so the review can say when it went.
    await queryRunner.query(`ALTER TABLE "impact_review_items" ADD "notice_message_id" uuid`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "impact_review_items" DROP COLUMN "notice_message_id"`);
    await queryRunner.query(`ALTER TABLE "outbox_messages" DROP COLUMN "reply_to"`);
    await queryRunner.query(`ALTER TABLE "outbox_messages" DROP COLUMN "from_name"`);
  }
}
