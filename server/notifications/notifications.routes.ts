import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { endpoint, paging } from '../http/endpoint';
import { listMailbox } from './mailbox.service';

export function notificationsRoutes(db: DataSource): Router {
  const router = Router();
  endpoint(
    router,
    '/api/mailbox',
    { method: 'get', path: '/', summary: 'Messages the local SMTP sink received from this firm', access: 'mailbox.read', query: paging },
    ({ actor, query }) => listMailbox(db, actor, query),
  );
  return router;
}
