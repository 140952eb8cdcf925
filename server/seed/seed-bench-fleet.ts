import 'reflect-metadata';
import bcrypt from 'bcrypt';
import { addDays, dueOnForPlan, todayIn } from '../../shared/calibration/due-date';
import { assetTypes, type AssetType } from '../../shared/schemas/assets';
import { createDataSource } from '../db/data-source';
import { Scoped } from '../db/scoped';
import { fleetEntities, seedAssets, seedKits } from '../fleet';
import { organizationEntities } from '../organizations';
import { Organization } from '../organizations/organization.entity';
import { userEntities } from '../users';
import { User } from '../users/user.entity';
import { DEMO_PASSWORD } from './demo-people';

/**
 * Benchmark data: an invented firm with N assets (default 20,000) and a
 * sign-in `bench@bench.test` / nestkeeper-demo. Run:
 *   DATABASE_URL=… node --import tsx server/seed/seed-bench-fleet.ts [count]
 */
export const BENCH_EMAIL = 'bench@bench.test';

const specsFor: Partial<Record<AssetType, (i: number) => Record<string, unknown>>> = {
  tip: (i) => ({ lengthMm: 50 + (i % 10) * 25, positions: i % 3 ? ['vertical'] : ['vertical', 'horizontal'] }),
  battery: (i) => ({ nominalVoltageV: 14.4, ratedCapacityAh: 4 + (i % 8), chargeCycles: i % 400 }),
  smr: () => ({ diameterMm: 38.1 }),
  reference_sphere: () => ({ diameterMm: 38.1 }),
  scale_bar: (i) => ({ certifiedLengthMm: 1000 + (i % 3) * 650, expansionPpmPerK: 0.5 }),
};
const locations = ['Shop, bay 1', 'Shop, bay 2', 'Shop, spares cabinet', 'Van 1', 'Van 2', 'Shelf A', 'Shelf B', 'Shelf C'];

export async function seedBenchFleet(url: string, count: number) {
  // Only the tables this seed writes, so the seeds never import the top-level composition (which imports them).
  const db = await createDataSource(url, [...organizationEntities, ...userEntities, ...fleetEntities], 2).initialize();
  try {
    const existing = await db.getRepository(User).findOne({ where: { email: BENCH_EMAIL } });
    if (existing) return { organizationId: existing.organizationId, created: 0 };
    return await db.transaction(async (manager) => {
      const org = await manager.save(
        Organization,
        manager.create(Organization, { name: 'Thornbury Bench Works', timeZone: 'Europe/Berlin', currency: 'EUR', settings: {} }),
      );
      const tx = new Scoped(manager, org.id);
      await tx.insert(User, { email: BENCH_EMAIL, name: 'Bench Runner', role: 'owner', passwordHash: await bcrypt.hash(DEMO_PASSWORD, 12) });
      const kits = await seedKits(
        tx,
        Array.from({ length: 200 }, (_, k) => ({ name: `Bench kit ${k + 1}`, notes: null })),
      );
      const today = todayIn(org.timeZone);
      const rows = Array.from({ length: count }, (_, i) => {
        const type = assetTypes[i % assetTypes.length];
        const required = !['case', 'nest', 'accessory', 'controller', 'battery'].includes(type);
        const lastCalibratedOn = required ? addDays(today, -((i * 37) % 420)) : null;
        return {
          type,
          assetTag: `B${type.slice(0, 3).toUpperCase()}-${String(i + 1).padStart(5, '0')}`,
          serialNumber: `SN${(100000 + i * 7919).toString(36).toUpperCase()}`,
          manufacturer: ['Orrinvale Optics', 'Thistlegate Instruments', 'Carrow & Finch', 'Brindlecell', 'Ashmere Gauge'][i % 5],
          model: `Model ${(i % 17) + 1}`,
          firmwareVersion: ['tracker', 'controller', 'probe'].includes(type) ? `5.${i % 4}.0` : null,
          rfidTag: type === 'tip' ? `E2:B0:${i.toString(16).toUpperCase().padStart(6, '0')}` : null,
          location: locations[i % locations.length],
          replacementValueMinor: 10_000 + (i % 50) * 1_000,
          notes: null,
          // By the round through the types, not `i`: with 12 types, `i % 6` put every SMR at the lab.
          status: (['ready', 'ready', 'ready', 'out', 'held', 'at_lab'] as const)[Math.floor(i / assetTypes.length) % 6],
          specs: specsFor[type]?.(i) ?? {},
          kitId: i % 4 === 0 ? kits[i % kits.length] : null,
          calibrationRequired: required,
          calibrationIntervalMonths: required ? 12 : null,
          calibrationProvider: required ? 'Fenmoor Calibration Lab' : null,
          lastCalibratedOn,
          dueOn: dueOnForPlan({ required, intervalMonths: required ? 12 : null, lastCalibratedOn }),
        };
      });
      await seedAssets(tx, rows, 2000);
      return { organizationId: org.id, created: count };
    });
  } finally {
    await db.destroy();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const count = Number(process.argv[2] ?? process.env.BENCH_ASSETS ?? 20_000);
  seedBenchFleet(process.env.DATABASE_URL!, count).then(
    (r) => console.log(r.created ? `Seeded ${r.created} benchmark assets (sign in as ${BENCH_EMAIL}).` : 'Benchmark firm already present.'),
    (err) => {
      console.error(err);
      process.exit(1);
    },
  );
}
