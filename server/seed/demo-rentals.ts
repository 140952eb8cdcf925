import { randomUUID } from 'node:crypto';
import { taxMinor } from '../../shared/billing/quote';
import { settle, lateDaysBetween } from '../../shared/billing/settlement';
import type { AssetType } from '../../shared/assets/vocabulary';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { DepositAuthorization } from '../billing/deposit-authorization.entity';
import { Invoice, InvoicePayment } from '../billing/invoice.entity';
import { nextNumber, padded } from '../db/numbering';
import { seedBooking } from '../bookings';
import type { Scoped } from '../db/scoped';
import { fleetSnapshot, moveAssets, recordPastCustody, type AssetRecord } from '../fleet';
import { Hold } from '../holds/hold.entity';
import { Incident } from '../incidents/incident.entity';
import { Organization } from '../organizations/organization.entity';
import { Customer } from '../rentals/customer.entity';
import { priceRental } from '../rentals/pricing';
import { RateCard } from '../rentals/rate-card.entity';
import { Rental } from '../rentals/rental.entity';
import { User } from '../users/user.entity';

/** Invented renters of the invented demo firm. */
const renters = [
  {
    company: 'Larkspur Aero Structures',
    billingContact: 'Accounts payable',
    billingEmail: 'payables@larkspur-aero.test',
    address: 'Larkspur Field 1, Wrenhallow',
    taxNumber: 'WH-4471-2209',
  },
  {
    company: 'Hollowmere Turbine Works',
    billingContact: 'Edda Marchbank',
    billingEmail: 'finance@hollowmere.test',
    address: 'Hollowmere Road 40, Ostby',
    taxNumber: 'OB-1187-3310',
  },
  { company: 'Ostby Mould & Die', billingContact: 'Purchasing', billingEmail: 'purchasing@ostby-mould.test', address: 'Kiln Lane 5, Ostby', taxNumber: null },
  {
    company: 'Quarrington Rail Fabrication',
    billingContact: 'Works office',
    billingEmail: 'office@quarrington-rail.test',
    address: 'Quarrington Sidings 2',
    taxNumber: 'QR-5520-0418',
  },
];

/** The demo firm's own invoice details (invented). */
const issuer = {
  address: 'Forge Lane 12, 41877 Wrenhallow',
  taxNumber: 'WH-7781-0042',
  paymentTerms: 'Payment within 14 days of the invoice date, quoting the invoice number.',
  paymentDays: 14,
  bankDetails: 'Brackenmoor Dimensional Works · Wrenhallow Mutual Bank · IBAN XX00 0000 0000 0000 0000 00 (invented)',
};

/** Day, week (7 days), month (28 days) and late fee per day, in cents (invented prices). */
const rates: Record<AssetType, [number, number, number, number]> = {
  tracker: [42_000, 210_000, 680_000, 8000],
  controller: [6000, 30_000, 96_000, 1500],
  probe: [18_000, 90_000, 290_000, 4000],
  tip: [900, 4500, 14_400, 300],
  battery: [1200, 6000, 19_200, 300],
  smr: [1500, 7500, 24_000, 500],
  reference_sphere: [1000, 5000, 16_000, 300],
  nest: [400, 2000, 6400, 100],
  scale_bar: [4500, 22_500, 72_000, 1000],
  weather_station: [2500, 12_500, 40_000, 500],
  case: [800, 4000, 12_800, 200],
  accessory: [500, 2500, 8000, 100],
};

type Plan = {
  renter: number;
  kit?: string;
  spares?: AssetType[];
  from: number;
  to: number;
  back?: number;
  authorizedFrom?: number;
  settle: 'released' | 'captured' | 'open' | 'to_settle';
  credit?: string;
  damagedType?: AssetType;
};

/**
 * Customers, rate cards and rentals: five past rentals with their invoices
 * (one late, one corrected by a credit note), one out now whose deposit's card
 * authorization lapses within two days, and one back yesterday with a damaged
 * SMR whose deposit waits to be settled. Open authorizations carry no provider
 * id here; with the local payment fake the server places them at start
 * (server/seed/demo-deposit-authorizations.ts).
 */
export async function seedDemoRentals(tx: Scoped, timeZone: string) {
  const today = todayIn(timeZone);
  const at = (days: number, hour = 9) => new Date(`${addDays(today, days)}T${String(hour).padStart(2, '0')}:00:00Z`);
  const people = await tx.find(User, {});
  const clerk = people.find((p) => p.role === 'billing')!;
  const manager = people.find((p) => p.role === 'manager')!;
  await tx.manager.update(
    Organization,
    { id: tx.organizationId },
    {
      settings: () =>
        `settings || '${JSON.stringify({ taxRateBasisPoints: 1900, depositPolicy: { percent: 10, minMinor: 50_000, maxMinor: 2_500_000 }, issuer })}'::jsonb`,
    },
  );
  const customers: Customer[] = [];
  for (const r of renters) customers.push(await tx.insert(Customer, { ...r, notes: null, paymentCustomerId: null }));
  for (const [type, [d, w, m, late]] of Object.entries(rates))
    await tx.insert(RateCard, { assetType: type as AssetType, kitId: null, dayMinor: d, weekMinor: w, monthMinor: m, lateFeePerDayMinor: late });
  const { assets, kits } = await fleetSnapshot(tx);
  for (const name of ['Kit Birch', 'Kit Cedar'])
    await tx.insert(RateCard, {
      assetType: null,
      kitId: kits.find((k) => k.name === name)!.id,
      dayMinor: 75_000,
      weekMinor: 360_000,
      monthMinor: 1_150_000,
      lateFeePerDayMinor: 15_000,
    });

  // Spares that may go out through the window: ready, not at the lab, calibrated well past it.
  const spare = (type: AssetType, until: string, taken: Set<string>): AssetRecord | undefined =>
    assets.find((a) => a.type === type && !a.kitId && a.status === 'ready' && !taken.has(a.id) && (!a.calibrationRequired || (a.dueOn ?? '') > until));
  const plans: Plan[] = [
    { renter: 0, kit: 'Kit Birch', from: -170, to: -157, settle: 'released' },
    { renter: 1, kit: 'Kit Cedar', from: -140, to: -113, back: -111, settle: 'captured' },
    { renter: 2, kit: 'Kit Birch', from: -100, to: -94, settle: 'released', credit: 'Two days of bad weather on site; goodwill as agreed by phone' },
    { renter: 3, kit: 'Kit Cedar', from: -75, to: -62, settle: 'released' },
    { renter: 0, spares: ['scale_bar', 'weather_station'], from: -45, to: -39, settle: 'released' },
    { renter: 1, spares: ['weather_station', 'battery', 'nest'], from: -5, to: 9, authorizedFrom: -5, settle: 'open' },
    { renter: 3, spares: ['smr', 'nest'], from: -6, to: -1, authorizedFrom: -6, settle: 'to_settle', damagedType: 'smr' },
  ];
  const taken = new Set<string>();
  let n = 0;
  for (const p of plans) {
    n += 1;
    const startsOn = addDays(today, p.from);
    const endsOn = addDays(today, p.to);
    const kit = p.kit ? kits.find((k) => k.name === p.kit)! : null;
    const items = kit
      ? assets.filter((a) => a.kitId === kit.id && a.status !== 'held')
      : p.spares!.map((t) => spare(t, endsOn, taken)).filter((a): a is AssetRecord => !!a);
    items.forEach((a) => taken.add(a.id));
    const out = p.settle === 'open';
    const returnedOn = out ? null : addDays(today, p.back ?? p.to);
    const quote = await priceRental(tx, { kitId: kit?.id, assetIds: kit ? undefined : items.map((a) => a.id), startsOn, endsOn });
    const damaged = p.damagedType ? items.find((a) => a.type === p.damagedType)! : null;
    const checklist = (d: AssetRecord | null) =>
      items.map((a) => ({ assetId: a.id, present: true, condition: a === d ? ('damaged' as const) : ('good' as const) }));
    const rentalId = randomUUID();
    const booking = await seedBooking(
      tx,
      {
        startsOn,
        endsOn,
        state: out ? 'out' : 'returned',
        purpose: 'rental',
        rentalId,
        kitId: kit?.id ?? null,
        createdBy: clerk.id,
        checkedOutAt: at(p.from, 8),
        handedOverBy: manager.id,
        takenBy: customers[p.renter].billingContact,
        takenByUserId: null,
        checkoutChecklist: checklist(null),
        returnedAt: returnedOn ? at(p.back ?? p.to, 15) : null,
        receivedBy: returnedOn ? manager.id : null,
        broughtBackBy: returnedOn ? customers[p.renter].billingContact : null,
        returnChecklist: returnedOn ? checklist(damaged) : null,
      },
      items.map((a) => a.id),
    );
    const rental = await tx.insert(Rental, {
      id: rentalId,
      number: `R-${padded(await nextNumber(tx, 'rental'))}`,
      customerId: customers[p.renter].id,
      bookingId: booking.id,
      quote,
      depositMinor: quote.depositMinor,
      currency: quote.currency,
      paymentMethodId: 'pm_card_visa',
      note: null,
      createdBy: clerk.id,
      createdAt: at(p.from - 6, 10),
    });
    const renter = { holder: customers[p.renter].company, location: customers[p.renter].address };
    if (out)
      await moveAssets(
        tx,
        { userId: manager.id },
        items.map((a) => a.id),
        'out',
        { bookingId: booking.id, where: renter.location, counterpart: renter.holder },
      );
    else {
      const event = { actorUserId: manager.id, bookingId: booking.id };
      await recordPastCustody(tx, [
        ...items.map((a) => ({ ...event, ...renter, assetId: a.id, kind: 'checked_out' as const, note: null })),
        ...items.map((a) => ({
          ...event,
          assetId: a.id,
          kind: 'returned' as const,
          holder: null,
          location: a.location,
          note: a === damaged ? 'damaged: dent on the housing' : null,
        })),
      ]);
    }
    if (damaged) {
      const incident = await tx.insert(Incident, {
        assetId: damaged.id,
        kind: 'impact',
        description: 'Came back with a dent on the housing; the customer says it rolled off a fixture.',
        occurredAt: at(-1, 15),
        location: 'Counter',
        bookingId: booking.id,
        state: 'reported',
        resolution: null,
        chargeAmountMinor: null,
        reportedBy: manager.id,
      });
      const hold = await tx.insert(Hold, {
        assetId: damaged.id,
        reason: 'incident',
        summary: 'Damaged on rental: dent on the housing',
        incidentId: incident.id,
        checkId: null,
        startedAt: at(-1, 15),
        startedBy: manager.id,
        releasedAt: null,
        releasedBy: null,
        releaseEvidence: null,
      });
      await moveAssets(tx, { userId: manager.id }, [damaged.id], 'held', {
        why: hold.summary,
        details: { holdId: hold.id, reason: hold.reason, summary: hold.summary },
      });
    }

    // The deposit: a card authorization at checkout, settled at return for past rentals. One lasts
    // 7 days; longer past rentals show its renewals on the saved card (4 days 18 hours each on Visa).
    const lateDays = returnedOn ? lateDaysBetween(endsOn, returnedOn) : 0;
    const extras = settle({ quote, lateDays, damage: [], depositCapturedMinor: 0, cardChargedMinor: 0 }).extrasGrossMinor;
    const captured = p.settle === 'captured' ? Math.min(extras, quote.depositMinor) : 0;
    const settledAt = p.settle === 'captured' || p.settle === 'released' ? at(p.back ?? p.to, 16) : null;
    const authorizations: { createdAt: Date; captureBefore: Date; initiatedBy: 'customer' | 'merchant' }[] = [];
    let createdAt = p.authorizedFrom !== undefined ? new Date(at(p.authorizedFrom, 9).getTime() - 12 * 3_600_000) : at(p.from, 8);
    authorizations.push({ createdAt, captureBefore: new Date(createdAt.getTime() + 7 * 86_400_000), initiatedBy: 'customer' });
    while (settledAt && authorizations.at(-1)!.captureBefore < settledAt) {
      createdAt = new Date(authorizations.at(-1)!.captureBefore.getTime() - 36 * 3_600_000);
      authorizations.push({ createdAt, captureBefore: new Date(createdAt.getTime() + (4 * 24 + 18) * 3_600_000), initiatedBy: 'merchant' });
    }
    for (const [i, h] of authorizations.entries()) {
      const last = i === authorizations.length - 1;
      await tx.insert(DepositAuthorization, {
        rentalId: rental.id,
        kind: 'authorization',
        paymentIntentId: null,
        idempotencyKey: `demo:${rental.id}:authorization:${i + 1}`,
        state: !last ? 'replaced' : p.settle === 'captured' ? 'captured' : p.settle === 'released' ? 'released' : 'authorized',
        amountMinor: quote.depositMinor,
        capturedMinor: last ? captured : 0,
        cardBrand: 'visa',
        cardLast4: '4242',
        captureBefore: h.captureBefore,
        initiatedBy: h.initiatedBy,
        failureMessage: null,
        captureReason: last && captured ? `${lateDays} late days` : null,
        settledAt: last ? settledAt : authorizations[i + 1].createdAt,
        createdAt: h.createdAt,
      });
    }
    if (!returnedOn || p.settle === 'to_settle') continue;

    const s = settle({ quote, lateDays, damage: [], depositCapturedMinor: captured, cardChargedMinor: 0 });
    const issuedOn = addDays(today, (p.back ?? p.to) + 1);
    const customer = customers[p.renter];
    const snapshot = {
      company: customer.company,
      billingContact: customer.billingContact,
      billingEmail: customer.billingEmail,
      address: customer.address,
      taxNumber: customer.taxNumber,
    };
    const base = {
      rentalId: rental.id,
      customerId: customer.id,
      issuedBy: clerk.id,
      currency: quote.currency,
      taxRateBasisPoints: quote.taxRateBasisPoints,
      customer: snapshot,
      issuer,
    };
    const invoice = await tx.insert(Invoice, {
      ...base,
      kind: 'invoice',
      number: `${issuedOn.slice(0, 4)}-${padded(await nextNumber(tx, `invoice:${issuedOn.slice(0, 4)}`))}`,
      correctsInvoiceId: null,
      issuedOn,
      issuedAt: at((p.back ?? p.to) + 1, 10),
      lines: s.lines,
      subtotalMinor: s.subtotalMinor,
      taxMinor: s.taxMinor,
      totalMinor: s.totalMinor,
      depositCapturedMinor: s.depositCapturedMinor,
      cardChargedMinor: 0,
      balanceMinor: s.balanceMinor,
      reason: null,
    });
    const amount = p.credit ? Math.round(s.subtotalMinor * 0.1) : 0;
    const tax = taxMinor(amount, quote.taxRateBasisPoints);
    if (p.credit) {
      await tx.insert(Invoice, {
        ...base,
        kind: 'credit_note',
        number: `CN-${issuedOn.slice(0, 4)}-${padded(await nextNumber(tx, `credit_note:${issuedOn.slice(0, 4)}`))}`,
        correctsInvoiceId: invoice.id,
        issuedOn: addDays(issuedOn, 3),
        issuedAt: at((p.back ?? p.to) + 4, 10),
        lines: [{ kind: 'credit', description: `Credit against invoice ${invoice.number}: ${p.credit}`, quantity: 1, unitMinor: amount, amountMinor: amount }],
        subtotalMinor: amount,
        taxMinor: tax,
        totalMinor: amount + tax,
        depositCapturedMinor: 0,
        cardChargedMinor: 0,
        balanceMinor: -(amount + tax),
        reason: p.credit,
      });
    }
    // Invoices older than ten weeks were paid by transfer (the balance after any credit note); the newer ones are still open.
    if ((p.back ?? p.to) + 1 < -70) {
      await tx.insert(InvoicePayment, {
        invoiceId: invoice.id,
        amountMinor: s.balanceMinor - amount - tax,
        receivedOn: addDays(issuedOn, 12),
        reference: `Transfer ${customer.company.split(' ')[0].toUpperCase()}-${invoice.number}`,
        recordedBy: clerk.id,
      });
    }
  }
  return { rentals: n };
}
