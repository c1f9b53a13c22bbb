import { Router, type Response } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentHomeowner, currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { transferPreviewInput, transferRedeemInput } from '../../../shared/schemas/record-transfers';
import { recordTransfersService } from './record-transfers.service';

/** See shared/schemas/record-transfers.ts for the routes and who may call them. */
export function recordTransferRoutes(ctx: AppContext) {
  const router = Router();
  const service = recordTransfersService(ctx);
  const noStore = (res: Response) => res.setHeader('Cache-Control', 'private, no-store');

  defineRoute(router, 'post', '/appliances/:id/record-transfers', { access: { permission: 'records:transfer' }, schemas: { params: uuidParam }, status: 201 }, ({ params }, _req, res) => {
    noStore(res);
    return service.createAsOffice(currentMember(res), params.id);
  });
  defineRoute(router, 'get', '/appliances/:id/record-transfers', { access: { permission: 'records:transfer' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.list(currentMember(res), params.id),
  );
  defineRoute(router, 'post', '/record-transfers/:id/withdraw', { access: { permission: 'records:transfer' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.withdrawAsOffice(currentMember(res), params.id),
  );
  defineRoute(router, 'post', '/homeowner/appliances/:id/record-transfers', { access: 'homeowner', schemas: { params: uuidParam }, status: 201 }, ({ params }, _req, res) => {
    noStore(res);
    return service.createAsHomeowner(currentHomeowner(res), params.id);
  });
  defineRoute(router, 'post', '/homeowner/record-transfers/:id/withdraw', { access: 'homeowner', schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.withdrawAsHomeowner(currentHomeowner(res), params.id),
  );
  defineRoute(router, 'post', '/record-transfers/preview', { access: { permission: 'records:transfer' }, schemas: { body: transferPreviewInput } }, ({ body }, _req, res) =>
    service.preview(currentMember(res), body.code),
  );
  defineRoute(router, 'post', '/record-transfers/redeem', { access: { permission: 'records:transfer' }, schemas: { body: transferRedeemInput }, status: 201 }, ({ body }, _req, res) =>
    service.redeem(currentMember(res), body),
  );
  return router;
}
