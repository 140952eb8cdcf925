import { Router } from 'express';
import { z } from 'zod';
import {
  calibrationEventFields,
  impactAssessmentPayload,
  intervalDecisionPayload,
  labTripPayload,
  labWindowsQuery,
  noticePayload,
} from '../../shared/schemas/calibration';
import { dueItemsCsv, dueItemsPdf } from '../documents/calibration-review';
import { endpoint } from '../http/endpoint';
import { sendDocument } from '../http/send-file';
import type { CalibrationService } from './calibration.service';
import type { ImpactService } from './impact.service';
import type { LabService } from './lab.service';
import type { ReviewService } from './review.service';

const certificateUpload = { files: 'certificate', maxFiles: 1, maxBytes: 20 * 1024 * 1024 };

type Services = { calibration: CalibrationService; impact: ImpactService; lab: LabService; review: ReviewService };

/** Mounted at /api: certificates, lab trips, the review page and impact reviews. */
export function calibrationRoutes({ calibration, impact, lab, review }: Services): Router {
  const router = Router();
  const at = '/api';
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/assets/:id/calibrations',
      summary: 'Record a calibration with its certificate PDF (multipart)',
      access: 'calibration.record',
      body: calibrationEventFields,
      upload: certificateUpload,
      status: 201,
    },
    ({ actor, params, body, files }) => calibration.record(actor, params.id, body, files[0]),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/assets/:id/calibrations', summary: "An item's calibrations, newest first", access: 'fleet.read' },
    ({ actor, params }) => calibration.list(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/calibrations/:id/certificate.pdf', summary: 'The certificate PDF (organization only)', access: 'fleet.read' },
    async ({ actor, params, res }) => {
      const file = await calibration.certificate(actor, params.id);
      sendDocument(res, file.data, 'application/pdf', file.fileName, file.inline);
    },
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/calibrations/:id/interval',
      summary: 'Accept or decline the suggested next interval',
      access: 'impact.review',
      body: intervalDecisionPayload,
    },
    ({ actor, params, body }) => calibration.decideInterval(actor, params.id, body.decision),
  );
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/calibration/due',
      summary: 'Items overdue or due within the window, with the bookings they threaten',
      access: 'fleet.read',
      query: z.object({ withinDays: z.coerce.number().int().min(0).max(365).default(30) }),
    },
    ({ actor, query }) => review.due(actor, query.withinDays),
  );
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/calibration/review',
      summary: "The owner's review: due items, threatened bookings, timeline, lab, impact reviews",
      access: 'reports.read',
    },
    ({ actor }) => review.review(actor),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/calibration/review.csv', summary: 'All overdue and due-soon items as CSV', access: 'reports.read' },
    async ({ actor, res }) => {
      const r = await review.dueWithinWindow(actor);
      sendDocument(res, dueItemsCsv(r.items), 'text/csv; charset=utf-8', `recalibrations-${r.today}.csv`);
    },
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/calibration/review.pdf', summary: 'Overdue and due-soon items as a PDF report', access: 'reports.read' },
    async ({ actor, res }) => {
      const r = await review.dueWithinWindow(actor);
      sendDocument(res, await dueItemsPdf(r.firm, r.today, r.items), 'application/pdf', `recalibrations-${r.today}.pdf`, true);
    },
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/assets/:id/lab-windows', summary: 'When the item can go to the lab without breaking a booking', access: 'fleet.read' },
    ({ actor, params }) => lab.windows(actor, [params.id]),
  );
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/lab-windows',
      summary: 'When several items can go to the lab on one trip without breaking a booking (?assetIds=a,b,c)',
      access: 'fleet.read',
      query: labWindowsQuery,
    },
    ({ actor, query }) => lab.windows(actor, query.assetIds),
  );
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/lab-trips',
      summary: 'Lab trips',
      access: 'fleet.read',
      query: z.object({ state: z.enum(['planned', 'at_lab', 'back']).optional() }),
    },
    ({ actor, query }) => lab.list(actor, query.state),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/lab-trips',
      summary: 'Plan a lab trip (reserves the window on the board)',
      access: 'calibration.record',
      body: labTripPayload,
      status: 201,
    },
    ({ actor, body }) => lab.plan(actor, body),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/lab-trips/:id/send', summary: 'The items leave for the lab', access: 'calibration.record' },
    ({ actor, params }) => lab.send(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/assets/:id/impact', summary: "The item's latest out-of-tolerance impact review", access: 'fleet.read' },
    ({ actor, params }) => impact.forAsset(actor, params.id),
  );
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/impact-reviews',
      summary: 'Impact reviews',
      access: 'impact.review',
      query: z.object({ state: z.enum(['open', 'closed']).optional() }),
    },
    ({ actor, query }) => impact.list(actor, query.state),
  );
  endpoint(
    router,
    at,
    {
      method: 'put',
      path: '/impact-reviews/:id/bookings/:bookingId',
      summary: 'Assess one booking of the review',
      access: 'impact.review',
      body: impactAssessmentPayload,
    },
    ({ actor, params, body }) => impact.assess(actor, params.id, params.bookingId, body.assessment, body.note),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/impact-reviews/:id/accept-suggestions',
      summary: 'Accept the suggested triage for every booking not yet assessed (the numbers and rule are kept with each)',
      access: 'impact.review',
    },
    ({ actor, params }) => impact.acceptSuggestions(actor, params.id),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/impact-reviews/:id/notices',
      summary: 'Draft (or send, as edited) one notice per customer',
      access: 'impact.review',
      body: noticePayload,
    },
    ({ actor, params, body }) => impact.notices(actor, params.id, body.send, body.notices),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/impact-reviews/:id/close', summary: 'Close a review once every booking is assessed', access: 'impact.review' },
    ({ actor, params }) => impact.close(actor, params.id),
  );
  return router;
}
