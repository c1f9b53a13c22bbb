import { Router } from 'express';
import type { AppContext } from '../../context';
import { HttpError } from '../../lib/http-error';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { arriveByTagInput, tagAssignInput, tagBatchInput, tagCodeParam } from '../../../shared/schemas/tags';
import { visitsService } from '../visits';
import { tagsService } from './tags.service';

export function tagsRoutes(ctx: AppContext) {
  const router = Router();
  const service = tagsService(ctx);
  const visits = visitsService(ctx);

  defineRoute(router, 'post', '/tag-batches', { access: { permission: 'catalog:manage' }, schemas: { body: tagBatchInput }, status: 201 }, ({ body }, _req, res) =>
    service.createBatch(currentMember(res), body),
  );
  defineRoute(router, 'get', '/tag-batches', { access: { permission: 'catalog:manage' } }, (_input, _req, res) => service.listBatches(currentMember(res)));
  defineRoute(router, 'get', '/tag-batches/:id/pdf', { access: { permission: 'catalog:manage' }, schemas: { params: uuidParam } }, async ({ params }, _req, res) => {
    const { pdf, filename } = await service.batchPdf(currentMember(res), params.id);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `inline; filename="${filename}"`);
    res.end(Buffer.from(pdf));
  });
  defineRoute(router, 'post', '/tags/assign', { access: { permission: 'records:write' }, schemas: { body: tagAssignInput } }, ({ body }, _req, res) =>
    service.assign(currentMember(res), body),
  );
  defineRoute(router, 'get', '/appliances/:id/tags', { access: { permission: 'records:read' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.listForAppliance(currentMember(res), params.id),
  );
  defineRoute(router, 'get', '/tags/:code/resolve', { access: 'signed-in', schemas: { params: tagCodeParam } }, ({ params }, _req, res) =>
    service.resolve(res.locals.principal, params.code),
  );
  defineRoute(router, 'get', '/public/tags/:code', { access: 'public', schemas: { params: tagCodeParam } }, ({ params }) => service.publicInfo(params.code));
  // Arriving at a tagged appliance: the scan finds the record and starts (or resumes) this technician's visit.
  defineRoute(router, 'post', '/visits/arrive-by-tag', { access: { permission: 'visits:record' }, schemas: { body: arriveByTagInput } }, async ({ body }, _req, res) => {
    const actor = currentMember(res);
    const found = await service.resolve(actor, body.code);
    if (!('status' in found) || !found.applianceId) throw tagNotOnAppliance();
    return visits.start(actor, { applianceId: found.applianceId, type: body.type, arrivedAt: new Date().toISOString() });
  });
  return router;
}

function tagNotOnAppliance() {
  return new HttpError(409, 'tag_unassigned', 'This tag is not on an appliance yet. Attach it first.', { code: ['Not attached to an appliance yet.'] });
}
