import { addDays, todayIn } from '../../shared/calibration/due-date';
import { tipValidation } from '../../shared/checks/tip-validation';
import { twoFaceErrorUm } from '../../shared/checks/two-face';
import { lengthCheck } from '../../shared/checks/length-check';
import { AuditEvent } from '../audit/audit-event.entity';
import { seedBooking, seedJob } from '../bookings';
import { FieldCheck } from '../checks/field-check.entity';
import type { Scoped } from '../db/scoped';
import { fleetSnapshot, moveAssets, recordPastCustody, type AssetRecord, type KitRecord } from '../fleet';
import { Hold } from '../holds/hold.entity';
import { Incident } from '../incidents/incident.entity';
import { User } from '../users/user.entity';

/** Invented customers of the invented demo firm, with the tightest tolerance of each job (one left unrecorded). */
const customers = [
  {
    reference: 'J-2611',
    customerName: 'Larkspur Aero Structures',
    contactName: 'Quality office',
    contactEmail: 'quality@larkspur-aero.test',
    siteAddress: 'Hangar 3, Larkspur Field, Wrenhallow',
    tightestTolerance: { tolerance: { kind: 'fixed' as const, um: 25 }, distanceM: null, note: 'wing-spar bore position ±25 µm' },
  },
  {
    reference: 'J-2614',
    customerName: 'Hollowmere Turbine Works',
    contactName: 'Inspection lead',
    contactEmail: 'inspection@hollowmere.test',
    siteAddress: 'Bay 7, Hollowmere Road, Ostby',
    tightestTolerance: { tolerance: { kind: 'range' as const, aUm: 20, bUmPerM: 6 }, distanceM: 4.5, note: 'casing flange profile ±(20 µm + 6 µm/m)' },
  },
  {
    reference: 'J-2620',
    customerName: 'Quarrington Rail Fabrication',
    contactName: 'Works manager',
    contactEmail: 'works@quarrington-rail.test',
    siteAddress: 'Shop 2, Quarrington Sidings',
    tightestTolerance: { tolerance: { kind: 'fixed' as const, um: 100 }, distanceM: null, note: 'bogie frame pad height ±0.1 mm' },
  },
  {
    reference: 'J-2623',
    customerName: 'Fenwick Yard Shipbuilders',
    contactName: 'Hull survey',
    contactEmail: 'survey@fenwick-yard.test',
    siteAddress: 'Dry dock 1, Fenwick Quay',
    tightestTolerance: null,
  },
  {
    reference: 'J-2630',
    customerName: 'Larkspur Aero Structures',
    contactName: 'Quality office',
    contactEmail: 'quality@larkspur-aero.test',
    siteAddress: 'Jig hall, Larkspur Field, Wrenhallow',
    tightestTolerance: { tolerance: { kind: 'fixed' as const, um: 40 }, distanceM: null, note: 'jig pickup position ±40 µm' },
  },
];

/** A reading `um` micrometres from the reference along a different axis each time. */
const around = (ref: { x: number; y: number; z: number }, um: number) => {
  const d = um / 1000;
  return [
    { x: ref.x + d, y: ref.y, z: ref.z },
    { x: ref.x, y: ref.y - d * 0.8, z: ref.z + d * 0.6 },
    { x: ref.x - d * 0.6, y: ref.y + d * 0.8, z: ref.z },
    { x: ref.x, y: ref.y, z: ref.z - d },
  ];
};

/**
 * Field checks, incidents, jobs and bookings over the past and coming months:
 * tips with validation histories (one drifting toward its tolerance), a held
 * tip with an open incident, a tracker with two-face and length checks, kits
 * out on jobs (one late back), back-to-back reservations, and one reservation
 * a due date now threatens.
 */
export async function seedDemoActivity(tx: Scoped, timeZone: string) {
  const today = todayIn(timeZone);
  const at = (daysFromToday: number, hour = 9) => new Date(`${addDays(today, daysFromToday)}T${String(hour).padStart(2, '0')}:30:00Z`);
  const people = await tx.find(User, {});
  const tech = people.find((p) => p.role === 'technician')!;
  const manager = people.find((p) => p.role === 'manager')!;
  const { assets, kits } = await fleetSnapshot(tx);
  const byTag = (tag: string) => assets.find((a) => a.assetTag === tag)!;
  const members = (kit: KitRecord) => assets.filter((a) => a.kitId === kit.id);

  // Tip validations: every tip in a kit validated in both positions; TIP-002 drifting toward the 60 µm tolerance.
  const ref = { x: 2150.412, y: -403.118, z: 812.905 };
  const checks: Partial<FieldCheck>[] = [];
  const validation = (tip: AssetRecord, position: string, um: number, daysAgo: number) => {
    const r = tipValidation(ref, around(ref, um));
    checks.push({
      kind: 'tip_validation',
      assetId: tip.id,
      relatedAssetId: byTag('PRB-001').id,
      position,
      inputs: { reference: ref, readings: around(ref, um), tolerance: { kind: 'fixed', um: 60 }, distanceM: null, uncertaintyComponentsUm: null },
      result: r,
      toleranceUm: 60,
      expandedUncertaintyUm: 0,
      guardBandUm: 0,
      decisionRule: 'simple',
      decision: r.maxDeviationUm <= 60 ? 'pass' : 'fail',
      performedAt: at(-daysAgo),
      performedBy: tech.id,
      note: null,
    });
  };
  for (const tip of assets.filter((a) => a.type === 'tip' && a.kitId)) {
    for (const position of (tip.specs.positions as string[]) ?? []) {
      const drifting = tip.assetTag === 'TIP-002' && position === 'vertical';
      const series = drifting ? [20, 28, 36, 43, 50] : [14, 17, 12]; // TIP-002's trend meets 60 µm about a week from today
      series.forEach((um, i) => validation(tip, position, um, (series.length - i) * 30));
    }
  }
  // The tracker's intermediate checks against the scale bar and two-face.
  const tracker = byTag('TRK-001');
  const bar = byTag('BAR-001');
  // After its last calibration (40 days ago, see the calibration seed), so they do not count as evidence before it.
  for (const [daysAgo, errUm] of [
    [30, 22],
    [20, 31],
    [8, 27],
  ] as const) {
    const front = { x: 6200, y: 150, z: 1400 };
    const back = { x: 6200 + errUm / 1000, y: 150, z: 1400 };
    checks.push({
      kind: 'two_face',
      assetId: tracker.id,
      relatedAssetId: null,
      position: null,
      inputs: { front, back, distanceM: 6.2, tolerance: { kind: 'fixed', um: 69.6 }, uncertaintyComponentsUm: null },
      result: { errorUm: twoFaceErrorUm(front, back) },
      toleranceUm: 69.6,
      expandedUncertaintyUm: 0,
      guardBandUm: 0,
      decisionRule: 'simple',
      decision: 'pass',
      performedAt: at(-daysAgo),
      performedBy: tech.id,
      note: null,
    });
    const endB = { x: 2300.012 + 0.0276 + errUm / 2000, y: 0, z: 0 };
    const length = lengthCheck({ x: 0, y: 0, z: 0 }, endB, 2300.012, 0.5, 44);
    checks.push({
      kind: 'length_check',
      assetId: tracker.id,
      relatedAssetId: bar.id,
      position: null,
      inputs: {
        endA: { x: 0, y: 0, z: 0 },
        endB,
        temperatureC: 44,
        distanceM: 4,
        tolerance: { kind: 'fixed', um: 52 },
        uncertaintyComponentsUm: null,
        scaleBar: { assetTag: bar.assetTag, certifiedLengthMm: 2300.012, expansionPpmPerK: 0.5 },
      },
      result: length,
      toleranceUm: 52,
      expandedUncertaintyUm: 0,
      guardBandUm: 0,
      decisionRule: 'simple',
      decision: Math.abs(length.errorUm) <= 52 ? 'pass' : 'fail',
      performedAt: at(-daysAgo, 11),
      performedBy: tech.id,
      note: null,
    });
  }
  await tx.insertMany(FieldCheck, checks);

  // A spare tip dropped two days ago: held, with an open incident.
  const dropped = assets.find((a) => a.type === 'tip' && !a.kitId)!;
  const incident = await tx.insert(Incident, {
    assetId: dropped.id,
    kind: 'dropped',
    description: 'Slipped off the probe during a tip change and hit the floor plate. Ball looks fine, shank may be bent.',
    occurredAt: at(-2, 14),
    location: customers[1].siteAddress,
    bookingId: null,
    state: 'reported',
    resolution: null,
    chargeAmountMinor: null,
    reportedBy: tech.id,
  });
  const hold = await tx.insert(Hold, {
    assetId: dropped.id,
    reason: 'incident',
    summary: 'Dropped: slipped off the probe during a tip change',
    incidentId: incident.id,
    checkId: null,
    startedAt: at(-2, 14),
    startedBy: tech.id,
    releasedAt: null,
    releasedBy: null,
    releaseEvidence: null,
  });
  await moveAssets(tx, { userId: tech.id }, [dropped.id], 'held', {
    why: 'Dropped: reported from site',
    details: { holdId: hold.id, reason: hold.reason, summary: hold.summary },
  });

  // Jobs and bookings.
  const jobs: Awaited<ReturnType<typeof seedJob>>[] = [];
  for (const [i, c] of customers.entries()) {
    const start = [-60, -5, -12, 7, 14][i];
    const length = [6, 8, 9, 6, 6][i];
    jobs.push(await seedJob(tx, { ...c, startsOn: addDays(today, start), endsOn: addDays(today, start + length), leadTechnicianId: tech.id, notes: null }));
  }
  const [alder, birch, cedar, damson] = kits;
  type Plan = { kit: KitRecord; job: (typeof jobs)[number]; state: 'returned' | 'out' | 'reserved' };
  const plans: Plan[] = [
    { kit: alder, job: jobs[0], state: 'returned' },
    { kit: birch, job: jobs[1], state: 'out' },
    { kit: cedar, job: jobs[2], state: 'out' }, // ended three days ago: a late return
    { kit: damson, job: jobs[3], state: 'reserved' },
    { kit: damson, job: jobs[4], state: 'reserved' }, // back-to-back with the one before
  ];
  for (const p of plans) {
    const items = members(p.kit).filter((a) => a.status !== 'held');
    const out = p.state !== 'reserved';
    const booking = await seedBooking(
      tx,
      {
        startsOn: p.job.startsOn,
        endsOn: p.job.endsOn,
        state: p.state,
        purpose: 'job',
        jobId: p.job.id,
        kitId: p.kit.id,
        createdBy: manager.id,
        checkedOutAt: out ? new Date(`${p.job.startsOn}T07:45:00Z`) : null,
        handedOverBy: out ? manager.id : null,
        takenBy: out ? tech.name : null,
        takenByUserId: out ? tech.id : null,
        checkoutChecklist: out ? items.map((a) => ({ assetId: a.id, present: true, condition: 'good' as const })) : null,
        returnedAt: p.state === 'returned' ? new Date(`${p.job.endsOn}T16:10:00Z`) : null,
        receivedBy: p.state === 'returned' ? manager.id : null,
        broughtBackBy: p.state === 'returned' ? tech.name : null,
        returnChecklist: p.state === 'returned' ? items.map((a) => ({ assetId: a.id, present: true, condition: 'good' as const })) : null,
      },
      items.map((a) => a.id),
    );
    if (p.state === 'out')
      await moveAssets(
        tx,
        { userId: manager.id },
        items.map((a) => a.id),
        'out',
        { bookingId: booking.id, where: p.job.siteAddress, counterpart: tech.name },
      );
    if (p.state === 'returned') {
      const event = { actorUserId: manager.id, bookingId: booking.id, note: null };
      await recordPastCustody(tx, [
        ...items.map((a) => ({ ...event, assetId: a.id, kind: 'checked_out' as const, holder: tech.name, location: p.job.siteAddress })),
        ...items.map((a) => ({ ...event, assetId: a.id, kind: 'returned' as const, holder: null, location: a.location })),
      ]);
    }
    await tx.insert(AuditEvent, {
      actorUserId: manager.id,
      action: 'booking.created',
      subjectType: 'booking',
      subjectId: booking.id,
      details: { via: 'demo_seed' },
    });
  }
  return { checks: checks.length, bookings: plans.length };
}
