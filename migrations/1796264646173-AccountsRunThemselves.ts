import { MigrationInterface, QueryRunner } from "typeorm";

export class AccountsRunThemselves1796264646173 implements MigrationInterface {
    name = 'AccountsRunThemselves1796264646173'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "account_links" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "purpose" text NOT NULL,
                "token_hash" text NOT NULL,
                "email" text NOT NULL,
                "role" text,
                "user_id" uuid,
                "created_by" uuid,
                "expires_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "used_at" TIMESTAMP WITH TIME ZONE,
                "withdrawn_at" TIMESTAMP WITH TIME ZONE,
                "sent_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_e03b1e79173941b176b58836ecd" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_00afbbbaad7aa106e70e273d3b" ON "account_links" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "IDX_0c2e20e8aa37ab904b00e4cd5b" ON "account_links" ("token_hash")
        `);
        await queryRunner.query(`
            CREATE TABLE "user_sessions" (
                "organization_id" uuid NOT NULL,
                "id" uuid NOT NULL,
                "user_id" uuid NOT NULL,
                "user_agent" text NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "last_seen_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "ended_at" TIMESTAMP WITH TIME ZONE,
                CONSTRAINT "PK_e93e031a5fed190d4789b6bfd83" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_f76b6c8466472fe8a0a97d9af5" ON "user_sessions" ("organization_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_e9658e959c490b0a634dfc5478" ON "user_sessions" ("user_id")
        `);
        await queryRunner.query(`
            ALTER TABLE "users"
            ADD "totp_secret" text
        `);
        await queryRunner.query(`
            ALTER TABLE "users"
            ADD "totp_enabled_at" TIMESTAMP WITH TIME ZONE
        `);
        await queryRunner.query(`
            ALTER TABLE "users"
            ADD "totp_last_step" bigint
        `);
        await queryRunner.query(`
            ALTER TABLE "users"
            ADD "recovery_code_hashes" jsonb NOT NULL DEFAULT '[]'
        `);
        await queryRunner.query(`
            ALTER TABLE "account_links"
            ADD CONSTRAINT "FK_00afbbbaad7aa106e70e273d3be" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "account_links"
            ADD CONSTRAINT "FK_d6c82edbecf4f6409b579e78b0d" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "user_sessions"
            ADD CONSTRAINT "FK_f76b6c8466472fe8a0a97d9af55" FOREIGN KEY ("organization_id") REFERENCES "organizations"("id") ON DELETE RESTRICT ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "user_sessions"
            ADD CONSTRAINT "FK_e9658e959c490b0a634dfc54783" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "user_sessions" DROP CONSTRAINT "FK_e9658e959c490b0a634dfc54783"
        `);
        await queryRunner.query(`
            ALTER TABLE "user_sessions" DROP CONSTRAINT "FK_f76b6c8466472fe8a0a97d9af55"
        `);
        await queryRunner.query(`
            ALTER TABLE "account_links" DROP CONSTRAINT "FK_d6c82edbecf4f6409b579e78b0d"
        `);
        await queryRunner.query(`
            ALTER TABLE "account_links" DROP CONSTRAINT "FK_00afbbbaad7aa106e70e273d3be"
        `);
        await queryRunner.query(`
            ALTER TABLE "users" DROP COLUMN "recovery_code_hashes"
        `);
        await queryRunner.query(`
            ALTER TABLE "users" DROP COLUMN "totp_last_step"
        `);
        await queryRunner.query(`
            ALTER TABLE "users" DROP COLUMN "totp_enabled_at"
        `);
        await queryRunner.query(`
            ALTER TABLE "users" DROP COLUMN "totp_secret"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_e9658e959c490b0a634dfc5478"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_f76b6c8466472fe8a0a97d9af5"
        `);
        await queryRunner.query(`
            DROP TABLE "user_sessions"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_0c2e20e8aa37ab904b00e4cd5b"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_00afbbbaad7aa106e70e273d3b"
        `);
        await queryRunner.query(`
            DROP TABLE "account_links"
        `);
    }

}
