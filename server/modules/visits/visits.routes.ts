import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { amendmentInput, swapInput, visitCompleteInput, visitDraftInput, visitStartInput } from '../../../shared/schemas/visits';
import { visitsService } from './visits.service';

/** Visits are for the company's team; homeowners read their record elsewhere and get 403 here. */
export function visitsRoutes(ctx: AppContext) {
  const router = Router();
  const service = visitsService(ctx);

  defineRoute(router, 'post', '/visits', { access: { permission: 'visits:record' }, schemas: { body: visitStartInput } }, ({ body }, _req, res) =>
    service.start(currentMember(res), body),
  );
  defineRoute(router, 'get', '/visits/:id', { access: { permission: 'records:read' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.get(currentMember(res), params.id),
  );
  defineRoute(
    router,
    'put',
    '/visits/:id/draft',
    { access: { permission: 'visits:record' }, schemas: { params: uuidParam, body: visitDraftInput } },
    ({ params, body }, _req, res) => service.saveDraft(currentMember(res), params.id, body),
  );
  defineRoute(
    router,
    'post',
    '/visits/:id/swaps',
    { access: { permission: 'visits:record' }, schemas: { params: uuidParam, body: swapInput } },
    ({ params, body }, _req, res) => service.swap(currentMember(res), params.id, body),
  );
  defineRoute(
    router,
    'post',
    '/visits/:id/complete',
    { access: { permission: 'visits:record' }, schemas: { params: uuidParam, body: visitCompleteInput } },
    ({ params, body }, _req, res) => service.complete(currentMember(res), params.id, body),
  );
  // Who may amend depends on the visit (its own technician or a manager), so the service finishes the check.
  defineRoute(
    router,
    'post',
    '/visits/:id/amendments',
    { access: { permission: 'visits:amend-own' }, schemas: { params: uuidParam, body: amendmentInput } },
    ({ params, body }, _req, res) => service.amend(currentMember(res), params.id, body),
  );
  return router;
}
