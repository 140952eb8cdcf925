import type { MigrationInterface, QueryRunner } from 'typeorm';

export class AgreementAcceptancesAppendOnly1796271376090 implements MigrationInterface {
  name = 'AgreementAcceptancesAppendOnly1796271376090';

  public async up(queryRunner: QueryRunner): Promise<void> {
    // A renter's acceptance is evidence (who, when, from where, which exact PDF): kept as written, like the audit trail.
    await queryRunner.query(`
            CREATE TRIGGER agreement_acceptances_append_only BEFORE UPDATE OR DELETE OR TRUNCATE ON "agreement_acceptances"
            FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_to_append_only()
        `);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TRIGGER agreement_acceptances_append_only ON "agreement_acceptances"`);
  }
}
