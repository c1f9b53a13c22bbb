import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { bookingInput, bookingListQuery, bookingMoveInput, bookingReasonInput, loadListQuery, roundQuery, unbookedQuery } from '../../../shared/schemas/bookings';
import { bookingsService } from './bookings.service';
import { unbookedService } from './unbooked.service';

export function bookingRoutes(ctx: AppContext) {
  const router = Router();
  const service = bookingsService(ctx);
  const unbooked = unbookedService(ctx);

  defineRoute(router, 'post', '/bookings', { access: { permission: 'bookings:book' }, schemas: { body: bookingInput }, status: 201 }, ({ body }, _req, res) =>
    service.create(currentMember(res), body),
  );
  defineRoute(router, 'get', '/bookings', { access: { permission: 'bookings:read' }, schemas: { query: bookingListQuery } }, ({ query }, _req, res) =>
    service.list(currentMember(res), query),
  );
  // Before /bookings/:id, which would read "unbooked" as an id.
  defineRoute(router, 'get', '/bookings/unbooked', { access: { permission: 'bookings:plan' }, schemas: { query: unbookedQuery } }, ({ query }, _req, res) =>
    unbooked.list(currentMember(res).companyId, query),
  );
  defineRoute(router, 'get', '/bookings/:id', { access: { permission: 'bookings:read' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.get(currentMember(res), params.id),
  );
  defineRoute(
    router,
    'post',
    '/bookings/:id/move',
    { access: { permission: 'bookings:manage' }, schemas: { params: uuidParam, body: bookingMoveInput } },
    ({ params, body }, _req, res) => service.move(currentMember(res), params.id, body),
  );
  defineRoute(router, 'post', '/bookings/:id/confirm', { access: { permission: 'bookings:manage' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.confirm(currentMember(res), params.id),
  );
  defineRoute(
    router,
    'post',
    '/bookings/:id/cancel',
    { access: { permission: 'bookings:manage' }, schemas: { params: uuidParam, body: bookingReasonInput } },
    ({ params, body }, _req, res) => service.close(currentMember(res), params.id, 'cancelled', body.reason),
  );
  defineRoute(
    router,
    'post',
    '/bookings/:id/no-access',
    { access: { permission: 'bookings:book' }, schemas: { params: uuidParam, body: bookingReasonInput } },
    ({ params, body }, _req, res) => service.close(currentMember(res), params.id, 'no_access', body.reason),
  );
  defineRoute(router, 'get', '/rounds', { access: { permission: 'bookings:read' }, schemas: { query: roundQuery } }, ({ query }, _req, res) =>
    service.round(currentMember(res), query),
  );
  defineRoute(router, 'get', '/load-list', { access: { permission: 'bookings:read' }, schemas: { query: loadListQuery } }, ({ query }, _req, res) =>
    service.loadList(currentMember(res), query),
  );
  return router;
}
