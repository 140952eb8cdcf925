import { addDays, dueOnForPlan, todayIn } from '../../shared/calibration/due-date';
import type { AssetType } from '../../shared/schemas/assets';
import { AuditEvent } from '../audit/audit-event.entity';
import type { Scoped } from '../db/scoped';
import { noteCustody, seedAssets, seedKits, type SeedAsset as AssetRow } from '../fleet';

/** Invented makers and models: none of these names belongs to a real company or product. */
const makers: Record<AssetType, { maker: string; model: string; interval: number | null; value: number; specs: () => Record<string, unknown> }> = {
  tracker: { maker: 'Orrinvale Optics', model: 'Sightline 12', interval: 12, value: 9_800_000, specs: () => ({ laserClass: '2', maxRangeM: 60 }) },
  controller: { maker: 'Orrinvale Optics', model: 'Hub 3', interval: null, value: 850_000, specs: () => ({}) },
  probe: { maker: 'Thistlegate Instruments', model: 'Wand 6', interval: 12, value: 3_200_000, specs: () => ({}) },
  tip: {
    maker: 'Thistlegate Instruments',
    model: 'Stylus 4 mm',
    interval: 12,
    value: 45_000,
    specs: () => ({ lengthMm: 100, positions: ['vertical', 'horizontal'] }),
  },
  battery: {
    maker: 'Brindlecell',
    model: 'Pack 14V7',
    interval: null,
    value: 38_000,
    specs: () => ({ nominalVoltageV: 14.4, ratedCapacityAh: 6.7, chargeCycles: 120 }),
  },
  smr: { maker: 'Carrow & Finch', model: 'Retro 1.5', interval: 24, value: 160_000, specs: () => ({ diameterMm: 38.1 }) },
  reference_sphere: { maker: 'Carrow & Finch', model: 'Datum Ball 38', interval: 24, value: 60_000, specs: () => ({ diameterMm: 38.1 }) },
  nest: { maker: 'Carrow & Finch', model: 'Mag Seat 38', interval: null, value: 12_000, specs: () => ({ sizeMm: 38.1 }) },
  scale_bar: {
    maker: 'Ashmere Gauge',
    model: 'Carbon Span 2300',
    interval: 12,
    value: 420_000,
    specs: () => ({ certifiedLengthMm: 2300.012, expansionPpmPerK: 0.5 }),
  },
  weather_station: { maker: 'Wexcombe Sensing', model: 'AirLog 3', interval: 12, value: 140_000, specs: () => ({}) },
  case: { maker: 'Hollin Cases', model: 'Roadbox 90', interval: null, value: 65_000, specs: () => ({ massKg: 31 }) },
  accessory: { maker: 'Carrow & Finch', model: 'Tripod Adapter', interval: null, value: 9_000, specs: () => ({}) },
};

const prefixes: Record<AssetType, string> = {
  tracker: 'TRK',
  controller: 'CTL',
  probe: 'PRB',
  tip: 'TIP',
  battery: 'BAT',
  smr: 'SMR',
  reference_sphere: 'SPH',
  nest: 'NST',
  scale_bar: 'BAR',
  weather_station: 'WX',
  case: 'CASE',
  accessory: 'ACC',
};

/** What travels in each demo kit. */
const kitContents: [AssetType, number][] = [
  ['tracker', 1],
  ['controller', 1],
  ['probe', 1],
  ['tip', 4],
  ['battery', 2],
  ['smr', 3],
  ['reference_sphere', 1],
  ['nest', 3],
  ['case', 1],
];
const kitNames = ['Kit Alder', 'Kit Birch', 'Kit Cedar', 'Kit Damson'];

type SeedAsset = { type: AssetType; kit: string | null; lastCalibratedDaysAgo: number | null; extra?: Partial<AssetRow> };

/** About 80 assets in four kits plus spares, with due dates spread so some are overdue and some due soon. */
export async function seedDemoFleet(tx: Scoped, timeZone: string, firm: string) {
  const today = todayIn(timeZone);
  const counters = new Map<AssetType, number>();
  const plan: SeedAsset[] = [];
  // Days since last calibration (12-month interval ≈ 365 days). Kit members are mostly current; the spares
  // carry the overdue and due-soon spread; Kit Damson's tracker falls due during its second booking.
  const kitAges = [40, 120, 200, 90, 10, 250, 160, 60, 280, 30];
  const spareAges = [345, 352, 372, 400, 300, 20, 180, 358, 390, 230];
  let n = 0;
  for (const kit of kitNames) {
    for (const [type, count] of kitContents) {
      for (let i = 0; i < count; i += 1) {
        const threatened = kit === 'Kit Damson' && type === 'tracker';
        plan.push({ type, kit, lastCalibratedDaysAgo: threatened ? 350 : kitAges[n++ % kitAges.length] });
      }
    }
  }
  let m = 0;
  for (const [type, count] of [
    ['tip', 4],
    ['battery', 3],
    ['smr', 2],
    ['scale_bar', 2],
    ['weather_station', 2],
    ['nest', 2],
    ['accessory', 2],
  ] as [AssetType, number][]) {
    for (let i = 0; i < count; i += 1) plan.push({ type, kit: null, lastCalibratedDaysAgo: spareAges[m++ % spareAges.length] });
  }
  // A large pack that needs carrier approval, and one that was dropped.
  plan.push({
    type: 'battery',
    kit: null,
    lastCalibratedDaysAgo: null,
    extra: { model: 'Pack 14V10', specs: { nominalVoltageV: 14.4, ratedCapacityAh: 10.4, chargeCycles: 48 } },
  });
  plan.push({
    type: 'battery',
    kit: null,
    lastCalibratedDaysAgo: null,
    extra: {
      specs: { nominalVoltageV: 14.4, ratedCapacityAh: 6.7, chargeCycles: 310, damaged: true },
      notes: 'Dropped from the van tail-lift; casing cracked. Do not charge.',
    },
  });

  const kitIds = await seedKits(
    tx,
    kitNames.map((name) => ({ name, notes: `Travels in one case set; packed at the ${firm} shop.` })),
  );
  const kits = new Map(kitNames.map((name, i) => [name, kitIds[i]]));

  const rows = plan.map((p, index) => {
    const m = makers[p.type];
    const number = (counters.get(p.type) ?? 0) + 1;
    counters.set(p.type, number);
    const assetTag = `${prefixes[p.type]}-${String(number).padStart(3, '0')}`;
    const required = m.interval !== null;
    const lastCalibratedOn = required && p.lastCalibratedDaysAgo !== null ? addDays(today, -p.lastCalibratedDaysAgo * (m.interval! / 12)) : null;
    return {
      type: p.type,
      assetTag,
      serialNumber: `${prefixes[p.type].slice(0, 2)}${(48213 + index * 37).toString(36).toUpperCase()}`,
      manufacturer: m.maker,
      model: m.model,
      firmwareVersion: ['tracker', 'controller', 'probe'].includes(p.type) ? `4.${index % 3}.${(index * 7) % 10}` : null,
      rfidTag: p.type === 'tip' ? `E2:80:11:${(0x40 + number).toString(16).toUpperCase()}:${(index * 13).toString(16).padStart(2, '0').toUpperCase()}` : null,
      location: p.kit ? `Shop, bay ${kitNames.indexOf(p.kit) + 1}` : 'Shop, spares cabinet',
      replacementValueMinor: m.value,
      notes: null,
      specs: m.specs(),
      kitId: p.kit ? kits.get(p.kit)! : null,
      calibrationRequired: required,
      calibrationIntervalMonths: m.interval,
      calibrationProvider: required ? (p.type === 'tracker' ? 'Fenmoor Calibration Lab' : 'Wrenhallow Gauge House') : null,
      lastCalibratedOn,
      dueOn: dueOnForPlan({ required, intervalMonths: m.interval, lastCalibratedOn }),
      ...p.extra,
    };
  });
  const ids = await seedAssets(tx, rows);
  await noteCustody(tx, null, ids, 'registered', { counterpart: firm, why: 'Demo data' });
  await tx.insertMany(
    AuditEvent,
    ids.map((id, i) => ({
      actorUserId: null,
      action: 'asset.created',
      subjectType: 'asset',
      subjectId: id,
      details: { assetTag: rows[i].assetTag, via: 'demo_seed' },
    })),
  );
  return ids.length;
}
