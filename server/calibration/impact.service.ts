import type { DataSource } from 'typeorm';
import { assessmentForSuggestion, triage, type AsFoundErrorSource, type JobTolerance, type TriageFacts } from '../../shared/calibration/triage';
import type { NoticeEdit } from '../../shared/schemas/calibration';
import type { AssetImpactView, ImpactAssessment, ImpactNoticesView, ImpactReviewView, NoticeGroup } from '../../shared/calibration/views';
import type { Page } from '../../shared/lists/page';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import { inOrganization, type Actor } from '../db/transaction';
import { getAsset, type AssetRecord } from '../fleet';
import { conflict, ruleBroken } from '../http/errors';
import { mailDeliveries, draftLetter, enqueueMail, firmSignature, letterTemplate, staffAddresses } from '../notifications';
import { ImpactReview, ImpactReviewItem } from './impact-review.entity';
import { listReply } from '../http/list-reply';
import { loadOrgContext } from '../organizations';
import { impactOpenedMail } from './calibration-mail';
import { noticeFor } from './impact-notices';

/** Day of the item's last passing evidence before `foundOn`: an in-tolerance calibration or a passing field check (on the firm's calendar). */
async function lastPassingEvidence(tx: Scoped, assetId: string, foundOn: string, excludeCheckId?: string) {
  const [row] = await tx.sql<{ since: string | null }>(
    `SELECT to_char(greatest(
        (SELECT max(performed_on) FROM calibration_events WHERE organization_id = $1 AND asset_id = $2 AND as_found = 'in_tolerance' AND performed_on < $3::date),
        (SELECT max((performed_at AT TIME ZONE o.time_zone)::date) FROM field_checks, organizations o
          WHERE field_checks.organization_id = $1 AND o.id = $1 AND asset_id = $2 AND decision = 'pass'
            AND (performed_at AT TIME ZONE o.time_zone)::date <= $3::date AND field_checks.id <> coalesce($4::uuid, '00000000-0000-0000-0000-000000000000'))
      ), 'YYYY-MM-DD') AS since`,
    [assetId, foundOn, excludeCheckId ?? null],
  );
  return row.since;
}

/**
 * Open the review for an item found out of tolerance, inside the caller's
 * transaction: every booking that took it out between its last passing
 * evidence and the finding, both days included.
 */
export async function openImpactReview(
  tx: Scoped,
  actor: Actor,
  asset: Pick<AssetRecord, 'id' | 'assetTag' | 'type' | 'serialNumber'>,
  found: { trigger: 'calibration' | 'check'; triggerId: string; foundOn: string },
) {
  const since = await lastPassingEvidence(tx, asset.id, found.foundOn, found.trigger === 'check' ? found.triggerId : undefined);
  const review = await tx.insert(ImpactReview, {
    assetId: asset.id,
    trigger: found.trigger,
    triggerId: found.triggerId,
    since,
    foundOn: found.foundOn,
    state: 'open',
    closedAt: null,
  });
  const bookings = await tx.sql<{ bookingId: string }>(
    `SELECT DISTINCT b.id AS "bookingId" FROM booking_items bi JOIN bookings b ON b.id = bi.booking_id
      WHERE bi.organization_id = $1 AND bi.asset_id = $2 AND b.state IN ('out', 'returned') AND b.purpose <> 'lab'
        AND b.starts_on <= $4::date AND ($3::date IS NULL OR b.ends_on >= $3::date)`,
    [asset.id, since, found.foundOn],
  );
  await tx.insertMany(
    ImpactReviewItem,
    bookings.map((b) => ({
      reviewId: review.id,
      bookingId: b.bookingId,
      assessment: null,
      note: null,
      assessedBy: null,
      assessedAt: null,
      noticeQueuedAt: null,
    })),
  );
  await recordAudit(
    tx,
    actor,
    'impact_review.opened',
    { type: 'asset', id: asset.id },
    { reviewId: review.id, since, foundOn: found.foundOn, bookings: bookings.length },
  );
  await enqueueMail(tx, await staffAddresses(tx, ['owner']), impactOpenedMail, {
    asset,
    foundOn: found.foundOn,
    byCalibration: found.trigger === 'calibration',
    since,
    bookings: bookings.length,
  });
  return review;
}

type ReviewRow = {
  bookingId: string;
  jobId: string | null;
  jobReference: string | null;
  customerName: string | null;
  contactName: string | null;
  contactEmail: string | null;
  rentalId: string | null;
  startsOn: string;
  endsOn: string;
  assessment: ImpactAssessment | null;
  note: string | null;
  noticeQueuedAt: Date | null;
  noticeMessageId: string | null;
  tightestTolerance: JobTolerance | null;
  triage: TriageFacts | null;
};

/** The as-found error a review weighs: the certificate's recorded value, or the failing check's judged result (µm). */
async function asFoundError(tx: Scoped, review: ImpactReview): Promise<{ errorUm: number | null; source: AsFoundErrorSource }> {
  const [row] =
    review.trigger === 'calibration'
      ? await tx.sql<{ errorUm: number | null }>(`SELECT as_found_error_um AS "errorUm" FROM calibration_events WHERE organization_id = $1 AND id = $2`, [
          review.triggerId,
        ])
      : await tx.sql<{ errorUm: number | null }>(
          `SELECT coalesce((result->>'maxDeviationUm')::float8, abs((result->>'errorUm')::float8)) AS "errorUm" FROM field_checks WHERE organization_id = $1 AND id = $2`,
          [review.triggerId],
        );
  return { errorUm: row?.errorUm ?? null, source: review.trigger === 'calibration' ? 'certificate' : 'check' };
}

export class ImpactService {
  constructor(private readonly db: DataSource) {}

  private async view(tx: Scoped, review: ImpactReview): Promise<ImpactReviewView> {
    const bookings = await tx.sql<ReviewRow>(
      `SELECT i.booking_id AS "bookingId", b.job_id AS "jobId", j.reference AS "jobReference", j.customer_name AS "customerName", j.contact_name AS "contactName", j.contact_email AS "contactEmail",
              b.rental_id AS "rentalId", to_char(b.starts_on, 'YYYY-MM-DD') AS "startsOn", to_char(b.ends_on, 'YYYY-MM-DD') AS "endsOn",
              i.assessment, i.note, i.notice_queued_at AS "noticeQueuedAt", i.notice_message_id AS "noticeMessageId", j.tightest_tolerance AS "tightestTolerance", i.triage
         FROM impact_review_items i JOIN bookings b ON b.id = i.booking_id LEFT JOIN jobs j ON j.id = b.job_id
        WHERE i.organization_id = $1 AND i.review_id = $2 ORDER BY b.starts_on`,
      [review.id],
    );
    const asFound = await asFoundError(tx, review);
    const { triageRatio } = await loadOrgContext(tx);
    const delivered = new Map(
      (
        await mailDeliveries(
          tx,
          bookings.flatMap((b) => (b.noticeMessageId ? [b.noticeMessageId] : [])),
        )
      ).map((d) => [d.id, d.sentAt]),
    );
    const rows = bookings.map(({ tightestTolerance, noticeMessageId, ...b }) => ({
      ...b,
      customerId: null,
      noticeQueuedAt: b.noticeQueuedAt?.toISOString() ?? null,
      noticeSentAt: (noticeMessageId && delivered.get(noticeMessageId)?.toISOString()) || null,
      toleranceNote: tightestTolerance?.note ?? null,
      suggestion: triage({ asFoundErrorUm: asFound.errorUm, errorSource: asFound.source, job: tightestTolerance, ratio: triageRatio }),
    }));
    return {
      id: review.id,
      assetId: review.assetId,
      asset: review.asset ? { id: review.asset.id, assetTag: review.asset.assetTag, type: review.asset.type } : undefined,
      trigger: review.trigger,
      triggerId: review.triggerId,
      since: review.since,
      foundOn: review.foundOn,
      state: review.state,
      bookings: rows,
      assessedCount: rows.filter((b) => b.assessment).length,
      asFound,
      triageRatio,
      remeasureCount: rows.filter((b) => (b.assessment ?? assessmentForSuggestion[b.suggestion.suggestion]) === 'remeasure_offered').length,
    };
  }

  /** GET /api/assets/:id/impact — the item's latest review. */
  forAsset(actor: Actor, assetId: string): Promise<AssetImpactView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      await getAsset(tx, assetId);
      const review = await tx.findOne(ImpactReview, { assetId }, { order: { createdAt: 'DESC' }, relations: { asset: true } });
      if (!review) return { since: null, foundOn: null, state: 'none', bookings: [] };
      return this.view(tx, review);
    });
  }

  list(actor: Actor, state?: 'open' | 'closed'): Promise<Page<ImpactReviewView>> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const reviews = await tx.find(ImpactReview, { where: state ? { state } : {}, order: { createdAt: 'DESC' }, relations: { asset: true }, take: 200 });
      return listReply(await Promise.all(reviews.map((r) => this.view(tx, r))));
    });
  }

  assess(actor: Actor, reviewId: string, bookingId: string, assessment: ImpactAssessment, note?: string): Promise<ImpactReviewView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const review = await tx.get(ImpactReview, { id: reviewId }, 'That impact review', { relations: { asset: true } });
      if (review.state === 'closed') throw ruleBroken('review_closed', 'This review is closed.');
      const item = await tx.get(ImpactReviewItem, { reviewId, bookingId }, 'That booking in the review');
      const { bookings } = await this.view(tx, review);
      await this.record(tx, actor, review, item, assessment, note ?? null, bookings.find((b) => b.bookingId === bookingId)!.suggestion);
      return this.view(tx, review);
    });
  }

  /** Accept the suggested triage for every booking not yet assessed. */
  acceptSuggestions(actor: Actor, reviewId: string): Promise<ImpactReviewView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const review = await tx.get(ImpactReview, { id: reviewId }, 'That impact review', { relations: { asset: true } });
      if (review.state === 'closed') throw ruleBroken('review_closed', 'This review is closed.');
      const { bookings } = await this.view(tx, review);
      const items = await tx.find(ImpactReviewItem, { where: { reviewId } });
      for (const b of bookings.filter((x) => !x.assessment)) {
        const item = items.find((i) => i.bookingId === b.bookingId)!;
        await this.record(tx, actor, review, item, assessmentForSuggestion[b.suggestion.suggestion], null, b.suggestion);
      }
      return this.view(tx, review);
    });
  }

  /** One assessment, with the triage the person saw (numbers, ratio, rule) kept beside it and in the audit trail. */
  private async record(
    tx: Scoped,
    actor: Actor,
    review: ImpactReview,
    item: ImpactReviewItem,
    assessment: ImpactAssessment,
    note: string | null,
    shown: TriageFacts,
  ) {
    Object.assign(item, { assessment, note, triage: shown, assessedBy: actor.userId, assessedAt: new Date() });
    await tx.save(ImpactReviewItem, item);
    await recordAudit(
      tx,
      actor,
      'impact_review.assessed',
      { type: 'asset', id: review.assetId },
      {
        reviewId: review.id,
        bookingId: item.bookingId,
        assessment,
        note,
        suggested: shown.suggestion,
        followsSuggestion: assessmentForSuggestion[shown.suggestion] === assessment,
        triage: shown,
      },
    );
  }

  close(actor: Actor, reviewId: string): Promise<ImpactReviewView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const review = await tx.get(ImpactReview, { id: reviewId }, 'That impact review', { relations: { asset: true } });
      const [{ n }] = await tx.sql<{ n: number }>(
        `SELECT count(*)::int AS n FROM impact_review_items WHERE organization_id = $1 AND review_id = $2 AND assessment IS NULL`,
        [reviewId],
      );
      if (n > 0) throw ruleBroken('review_incomplete', `${n} booking(s) still need an assessment before the review can close.`);
      review.state = 'closed';
      review.closedAt = new Date();
      await tx.save(ImpactReview, review);
      await recordAudit(tx, actor, 'impact_review.closed', { type: 'asset', id: review.assetId }, { reviewId });
      return this.view(tx, review);
    });
  }

  /**
   * One notice per customer and group (the booking's assessment, or pending) with an e-mail address. `send` queues them,
   * each with the subject and text the person edited (`edits`, matched by address and group) or else as drafted; the
   * words sent are kept in the audit trail, and each booking remembers its notice's outbox message.
   */
  notices(actor: Actor, reviewId: string, send: boolean, edits: NoticeEdit[] = []): Promise<ImpactNoticesView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const review = await tx.get(ImpactReview, { id: reviewId }, 'That impact review', { relations: { asset: true } });
      const view = await this.view(tx, review);
      type Group = { to: string; group: NoticeGroup; rows: (ImpactReviewView['bookings'][number] & { jobReference: string })[] };
      const groups = new Map<string, Group>();
      for (const b of view.bookings) {
        if (!b.contactEmail) continue;
        const group: NoticeGroup = b.assessment ?? 'pending';
        const key = `${b.contactEmail}\u0000${group}`;
        const entry = groups.get(key) ?? { to: b.contactEmail, group, rows: [] };
        entry.rows.push({ ...b, jobReference: b.jobReference ?? `the booking of ${b.startsOn}` });
        groups.set(key, entry);
      }
      const drafts: (Group & { customerName: string | null; subject: string; text: string })[] = [];
      for (const { to, group, rows } of groups.values()) {
        const { template, data } = noticeFor(view, review.asset!, group, rows);
        drafts.push({ to, group, rows, customerName: rows[0].customerName, ...(await draftLetter(tx, template, data)) });
      }
      if (send) {
        const stale = edits.find((e) => !drafts.some((d) => d.to === e.to && d.group === e.group));
        if (stale)
          throw conflict(`The notices changed since you opened them (nothing for ${stale.to} in that group now): reopen them, check the text and send again.`);
        const sent = [];
        for (const d of drafts) {
          const edit = edits.find((e) => e.to === d.to && e.group === d.group);
          const words = { subject: edit?.subject ?? d.subject, text: edit?.text ?? d.text };
          const message = await enqueueMail(tx, [d.to], letterTemplate, words);
          await tx.sql(
            `UPDATE impact_review_items SET notice_queued_at = now(), notice_message_id = $4 WHERE organization_id = $1 AND review_id = $2 AND booking_id = ANY($3)`,
            [reviewId, d.rows.map((r) => r.bookingId), message.id],
          );
          Object.assign(d, words);
          sent.push({ to: d.to, group: d.group, bookings: d.rows.map((r) => r.bookingId), ...words, edited: !!edit, messageId: message.id });
        }
        await recordAudit(tx, actor, 'impact_review.notices_sent', { type: 'asset', id: review.assetId }, { reviewId, notices: sent });
      }
      const firm = await firmSignature(tx);
      return {
        drafts: drafts.map((d) => ({
          to: d.to,
          customerName: d.customerName,
          group: d.group,
          jobReferences: d.rows.map((r) => r.jobReference),
          bookingIds: d.rows.map((r) => r.bookingId),
          subject: d.subject,
          text: d.text,
        })),
        sent: send,
        sender: { name: firm.name, replyTo: firm.replyTo, address: firm.address },
      };
    });
  }
}
