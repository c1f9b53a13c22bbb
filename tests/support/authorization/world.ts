import crypto from 'node:crypto';
import sharp from 'sharp';
import type { Express } from 'express';
import type { AppContext } from '../../../server/context';
import { invitations } from '../../../server/db/schema/index';
import { insertAppliance, insertCustomer, insertSite } from '../../../server/db/factories/records';
import { insertMember } from '../../../server/db/factories/users';
import { unsubscribeToken } from '../../../server/modules/reminders/unsubscribe-token';
import { generateTagCode } from '../../../shared/tags/tag-code';
import { agentsFor, createTenant, type Agent } from '../tenant';

const tokenOf = (url: string) => url.split('/s/')[1];

async function ok<T = Record<string, unknown>>(label: string, req: Promise<{ status: number; body: unknown }>, status = [200, 201]): Promise<T> {
  const res = await req;
  if (!status.includes(res.status)) throw new Error(`setting up the matrix: ${label} answered ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as T;
}

let colour = 0;
/** A JPEG no other upload in this file has, so each upload stores a new photo. */
export function uniqueJpeg() {
  colour += 1;
  // Colours far apart, so no two re-encode to the same picture.
  return sharp({ create: { width: 64, height: 48, channels: 3, background: { r: (colour * 53) % 256, g: (colour * 97) % 256, b: (colour * 29) % 256 } } })
    .jpeg()
    .toBuffer();
}

/**
 * One company with a record of every kind the API names by id: the tenant's people, a boiler on the homeowner's
 * customer with a part, a draft visit, an attached tag, a photo the homeowner may see, a share link, an open
 * invitation, a service request, and the company's own catalog, checklist and due rule.
 */
export async function buildWorld(ctx: AppContext, app: Express) {
  const tenant = await createTenant(ctx.db);
  const as = await agentsFor(app, tenant);
  const companyId = tenant.company.id;
  const site = await insertSite(ctx.db, { companyId, customerId: tenant.customer.id });
  const boiler = await insertAppliance(ctx.db, { companyId, siteId: site.id, components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 } }] });
  const spareAppliance = await insertAppliance(ctx.db, { companyId, siteId: site.id, kind: 'water_heater' });
  const spareCustomer = await insertCustomer(ctx.db, { companyId });

  const visit = await ok<{ id: string }>('visit', as.technician.post('/api/visits').send({ applianceId: boiler.id, type: 'repair' }));
  const batch = await ok<{ id: string; codes: string[] }>('tag batch', as.manager.post('/api/tag-batches').send({ count: 2, format: 'single_large' }));
  await ok('tag', as.technician.post('/api/tags/assign').send({ code: batch.codes[0], applianceId: boiler.id }));
  const link = await ok<{ id: string; url: string }>('share link', as.manager.post(`/api/appliances/${boiler.id}/share-links`).send({}));
  const shareToken = tokenOf(link.url);
  const upload = await ok<{ photos: { id: string }[] }>(
    'photo',
    as.technician
      .post('/api/photos')
      .field('applianceId', boiler.id)
      .field('kind', 'nameplate')
      .field('homeownerVisible', 'true')
      .attach('files', await uniqueJpeg(), { filename: 'plate.jpg', contentType: 'image/jpeg' }),
  );
  const request = await ok<{ id: string }>(
    'service request',
    as.anonymous.post(`/api/share/${shareToken}/service-requests`).send({ contactName: 'Matrix caller', contactPhone: '555-0142' }),
  );

  const importFile = await ok<{ id: string }>(
    'import file',
    as.manager
      .post('/api/imports')
      .attach('file', Buffer.from('Customer,Street,Town,Kind,Fuel\nMatrix Example,1 Matrix Row,Wrenfield,Steam,Gas\n'), { filename: 'matrix.csv', contentType: 'text/csv' }),
  );
  const templates = await ok<{ id: string; name: string; items: unknown[] }[]>('templates', as.owner.get('/api/checklist-templates'));
  const rules = await ok<Record<string, unknown>[]>('due rules', as.owner.get('/api/due-rules'));
  const rule = rules[0];

  const expiresAt = new Date(Date.now() + 7 * 86_400_000);
  // Addressed to this company's homeowner, so one caller is the invitee; the other is for an address nobody signs in with.
  const [forHomeowner, forNobody] = await ctx.db
    .insert(invitations)
    .values([
      { companyId, kind: 'member', role: 'technician', email: tenant.homeowner.user.email, invitedBy: tenant.owner.user.id, expiresAt },
      { companyId, kind: 'member', role: 'technician', email: `nobody-${crypto.randomUUID()}@example.test`, invitedBy: tenant.owner.user.id, expiresAt },
    ])
    .returning();

  const world = {
    tenant,
    as,
    companyId,
    siteId: site.id,
    applianceId: boiler.id,
    componentId: boiler.components[0].id,
    spareApplianceId: spareAppliance.id,
    visitId: visit.id,
    tagBatchId: batch.id,
    tagCode: batch.codes[0],
    spareTagCode: batch.codes[1],
    photoId: upload.photos[0].id,
    shareLinkId: link.id,
    shareToken,
    serviceRequestId: request.id,
    importId: importFile.id,
    invitationForHomeownerId: forHomeowner.id,
    invitationForNobodyId: forNobody.id,
    checklistTemplate: { id: templates[0].id, body: { name: templates[0].name, items: templates[0].items } },
    dueRule: {
      id: String(rule.id),
      body: {
        inspectionIntervalMonths: rule.inspectionIntervalMonths,
        replacementAgeYears: rule.replacementAgeYears,
        replacementPolicy: rule.replacementPolicy,
        basis: rule.basis,
        source: rule.source,
      },
    },
    catalogCode: 'thermocouple',
    unsubscribeToken: unsubscribeToken(ctx.config.BETTER_AUTH_SECRET, spareCustomer.id),
  };
  // Values that must never appear in an answer to another company's caller.
  const secrets = [
    companyId,
    site.id,
    spareCustomer.id,
    tenant.customer.id,
    tenant.customer.name,
    tenant.customer.email ?? '',
    boiler.serial ?? '',
    tenant.owner.user.id,
    tenant.manager.user.id,
    tenant.technician.user.id,
    tenant.homeowner.user.id,
    tenant.technician.membership.id,
    world.applianceId,
    world.componentId,
    world.spareApplianceId,
    world.visitId,
    world.tagBatchId,
    world.tagCode,
    world.photoId,
    world.shareLinkId,
    world.serviceRequestId,
    world.importId,
    world.invitationForHomeownerId,
    world.checklistTemplate.id,
    world.dueRule.id,
  ].filter((s) => s.length >= 6);
  return { ...world, secrets };
}

export type World = Awaited<ReturnType<typeof buildWorld>>;
export type Agents = World['as'];

/**
 * The same shape with every id replaced by one that exists nowhere, for proving that another company's id is
 * answered exactly like an id that does not exist.
 */
export function ghostOf(w: World): World {
  const uuid = () => crypto.randomUUID();
  return {
    ...w,
    companyId: uuid(),
    siteId: uuid(),
    applianceId: uuid(),
    componentId: uuid(),
    spareApplianceId: uuid(),
    visitId: uuid(),
    tagBatchId: uuid(),
    tagCode: generateTagCode(),
    spareTagCode: generateTagCode(),
    photoId: uuid(),
    shareLinkId: uuid(),
    shareToken: crypto.randomBytes(32).toString('base64url'),
    serviceRequestId: uuid(),
    importId: uuid(),
    invitationForHomeownerId: uuid(),
    invitationForNobodyId: uuid(),
    checklistTemplate: { ...w.checklistTemplate, id: uuid() },
    dueRule: { ...w.dueRule, id: uuid() },
    unsubscribeToken: `${uuid()}.${crypto.randomBytes(32).toString('base64url')}`,
    tenant: {
      ...w.tenant,
      customer: { ...w.tenant.customer, id: uuid() },
      technician: { ...w.tenant.technician, membership: { ...w.tenant.technician.membership, id: uuid() } },
    },
  };
}

/** A fresh member of the world's company, for routes that change a member for good. */
export async function spareTechnician(ctx: AppContext, w: World) {
  return (await insertMember(ctx.db, { companyId: w.companyId, role: 'technician' })).membership.id;
}

export async function shareLinkOn(w: World): Promise<{ id: string; token: string }> {
  const link = await ok<{ id: string; url: string }>('share link', w.as.manager.post(`/api/appliances/${w.applianceId}/share-links`).send({}));
  return { id: link.id, token: tokenOf(link.url) };
}

export async function memberInvitation(w: World): Promise<string> {
  const made = await ok<{ id: string }>('invitation', w.as.owner.post('/api/team/invitations').send({ email: `invitee-${crypto.randomUUID()}@example.test`, role: 'technician' }));
  return made.id;
}

export async function newAppliance(ctx: AppContext, w: World, components: Parameters<typeof insertAppliance>[1]['components'] = []) {
  return insertAppliance(ctx.db, { companyId: w.companyId, siteId: w.siteId, components });
}

export async function draftVisit(w: World, applianceId: string, agent: Agent = w.as.technician) {
  return ok<{ id: string; revision: number; checklist: { key: string; readings?: string[] }[] }>(
    'visit',
    agent.post('/api/visits').send({ applianceId, type: 'annual_maintenance' }),
  );
}

export { ok };
