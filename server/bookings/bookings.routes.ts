import { Router } from 'express';
import { z } from 'zod';
import {
  availabilityQuery,
  bookingDatesPayload,
  bookingItemsPayload,
  bookingListQuery,
  bookingPayload,
  checklistPayload,
  jobPayload,
  MAX_RETURN_PHOTOS,
  returnPayload,
} from '../../shared/schemas/bookings';
import { MAX_PHOTO_BYTES } from '../../shared/schemas/incidents';
import { text } from '../../shared/schemas/common';
import { endpoint, paging } from '../http/endpoint';
import { ruleBroken } from '../http/errors';
import { sendDocument } from '../http/send-file';
import type { BookingsService } from './bookings.service';
import type { CalendarService } from './calendar';
import type { DeskService } from './desk.service';
import type { HandoverService } from './handover.service';
import type { JobsRegisterService } from './jobs.service';

type Services = { bookings: BookingsService; handover: HandoverService; desk: DeskService; jobs: JobsRegisterService; calendar: CalendarService };

/** Mounted at /api: bookings, availability, jobs and the calendar feed. */
export function bookingsRoutes({ bookings, handover, desk, jobs, calendar }: Services): Router {
  const router = Router();
  const at = '/api';
  endpoint(
    router,
    at,
    { method: 'get', path: '/bookings/today', summary: "The counter's day: checkouts, returns, late returns, blocked bookings", access: 'bookings.read' },
    ({ actor }) => desk.today(actor),
  );
  endpoint(router, at, { method: 'get', path: '/bookings/mine', summary: 'Kit I carry now and next', access: 'bookings.read' }, ({ actor }) =>
    desk.mine(actor),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/bookings', summary: 'Bookings in a date window', access: 'bookings.read', query: bookingListQuery },
    ({ actor, query }) => bookings.list(actor, query),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/bookings',
      summary: 'Book a kit or assets for whole days (409 on overlap, 422 when an item may not go)',
      access: 'bookings.write',
      body: bookingPayload,
      status: 201,
    },
    ({ actor, body }) => {
      // A rental and its booking are made together, at quoted prices; a bare booking cannot claim one.
      if (body.rentalId)
        throw ruleBroken('rental_booking', 'Book a rental with the rental itself (POST /api/rentals): it books the items and fixes the prices together.');
      return bookings.create(actor, body);
    },
  );
  endpoint(router, at, { method: 'get', path: '/bookings/:id', summary: 'One booking with its items', access: 'bookings.read' }, ({ actor, params }) =>
    bookings.get(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'patch', path: '/bookings/:id', summary: 'Move a reserved booking (same rules)', access: 'bookings.write', body: bookingDatesPayload },
    ({ actor, params, body }) => bookings.reschedule(actor, params.id, body),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/bookings/:id/items',
      summary: 'Add, remove or swap items of a reserved booking (same refusals and alternatives as booking)',
      access: 'bookings.write',
      body: bookingItemsPayload,
    },
    ({ actor, params, body }) => bookings.changeItems(actor, params.id, body),
  );
  endpoint(router, at, { method: 'post', path: '/bookings/:id/cancel', summary: 'Cancel a reserved booking', access: 'bookings.write' }, ({ actor, params }) =>
    bookings.cancel(actor, params.id),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/bookings/:id/checkout',
      summary: 'Hand the kit over against its packing list',
      access: 'bookings.hand_over',
      body: checklistPayload,
    },
    ({ actor, params, body }) => handover.checkout(actor, params.id, body),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/bookings/:id/return',
      summary: 'Take the kit back; missing or damaged items open incidents (JSON, or multipart with photos[] and photoAssetIds naming each photo’s item)',
      access: 'bookings.hand_over',
      body: returnPayload,
      upload: { files: 'photos', maxFiles: MAX_RETURN_PHOTOS, maxBytes: MAX_PHOTO_BYTES },
    },
    ({ actor, params, body, files }) => handover.return(actor, params.id, body, files),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/bookings/:id/handover-sheet.pdf', summary: 'Hand-over sheet to sign at the counter (PDF)', access: 'bookings.read' },
    async ({ actor, params, res }) => sendDocument(res, await handover.sheet(actor, params.id), 'application/pdf', 'handover-sheet.pdf', true),
  );
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/availability',
      summary: 'Assets of a type free and calibrated through a window',
      access: 'bookings.read',
      query: availabilityQuery,
    },
    ({ actor, query }) => bookings.availability(actor, query),
  );
  endpoint(router, at, { method: 'get', path: '/jobs', summary: 'Customer site jobs', access: 'bookings.read', query: paging }, ({ actor, query }) =>
    jobs.list(actor, query),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/jobs', summary: 'Add a customer site job', access: 'bookings.write', body: jobPayload, status: 201 },
    ({ actor, body }) => jobs.create(actor, body),
  );
  endpoint(router, at, { method: 'get', path: '/jobs/:id', summary: 'One job', access: 'bookings.read' }, ({ actor, params }) => jobs.get(actor, params.id));
  endpoint(router, at, { method: 'put', path: '/jobs/:id', summary: 'Change a job', access: 'bookings.write', body: jobPayload }, ({ actor, params, body }) =>
    jobs.update(actor, params.id, body),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/calendar/token', summary: 'A new secret address for my calendar feed', access: 'bookings.read' },
    ({ actor }) => calendar.rotateToken(actor),
  );
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/calendar.ics',
      summary: 'Bookings and due dates as an iCalendar feed (RFC 5545)',
      access: 'public',
      query: z.object({ token: text(200).min(10, 'is required') }),
    },
    async ({ query, res }) => sendDocument(res, await calendar.feed(query.token), 'text/calendar; charset=utf-8', 'nestkeeper.ics', true),
  );
  return router;
}
