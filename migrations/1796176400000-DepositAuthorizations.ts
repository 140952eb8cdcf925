import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * "Hold" means an asset taken out of service (the holds table). The card side
 * of a deposit is named after what it is, a card authorization: the table,
 * its constraints and indexes follow, and the authorization rows' kind reads
 * `authorization` (charges above it stay `charge`).
 */
const renames: [kind: 'CONSTRAINT' | 'INDEX', from: string, to: string][] = [
    ['CONSTRAINT', 'PK_957812c816182760cf8243ebad9', 'PK_1884d69af8cc0416e725f43e309'],
    ['CONSTRAINT', 'FK_5ecdcd70eed5b31c321726f5483', 'FK_e7bb874bee7081bd5389362a30c'],
    ['CONSTRAINT', 'FK_abd1ece31f53665f821b8464645', 'FK_33d652ad25cab57130932be8f6d'],
    ['INDEX', 'IDX_5ecdcd70eed5b31c321726f548', 'IDX_e7bb874bee7081bd5389362a30'],
    ['INDEX', 'IDX_7f90e2ea012da8511360a7082f', 'IDX_d1e619f6f4573954946bc68870'],
    ['INDEX', 'IDX_387aa9309bab6dd24ac56d326f', 'IDX_57268b10f97e0ff167789ca17c'],
    ['INDEX', 'IDX_2a73a88fffa3dbc5f68bc2aca7', 'IDX_094a1aaab255847dab11e1006d'],
    ['INDEX', 'IDX_8a7ff8d1bb76ecb603d512238b', 'IDX_0d7166474b108c34445a38f5f7'],
];

export class DepositAuthorizations1796176400000 implements MigrationInterface {
    name = 'DepositAuthorizations1796176400000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "deposit_holds" RENAME TO "deposit_authorizations"
        `);
        for (const [kind, from, to] of renames) {
            await queryRunner.query(kind === 'INDEX' ? `ALTER INDEX "${from}" RENAME TO "${to}"` : `ALTER TABLE "deposit_authorizations" RENAME CONSTRAINT "${from}" TO "${to}"`);
        }
        await queryRunner.query(`
            ALTER TABLE "deposit_authorizations" ALTER COLUMN "kind" SET DEFAULT 'authorization'
        `);
        await queryRunner.query(`
            UPDATE "deposit_authorizations" SET "kind" = 'authorization' WHERE "kind" = 'hold'
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            UPDATE "deposit_authorizations" SET "kind" = 'hold' WHERE "kind" = 'authorization'
        `);
        await queryRunner.query(`
            ALTER TABLE "deposit_authorizations" ALTER COLUMN "kind" SET DEFAULT 'hold'
        `);
        for (const [kind, from, to] of renames) {
            await queryRunner.query(kind === 'INDEX' ? `ALTER INDEX "${to}" RENAME TO "${from}"` : `ALTER TABLE "deposit_authorizations" RENAME CONSTRAINT "${to}" TO "${from}"`);
        }
        await queryRunner.query(`
            ALTER TABLE "deposit_authorizations" RENAME TO "deposit_holds"
        `);
    }
}
