import crypto from 'node:crypto';
import type { AppContext } from '../../../server/context';
import { insertBooking } from '../../../server/db/factories/bookings';
import { bookingReplyToken } from '../../../server/modules/booking-notices/booking-reply-token';
import { transferCodeFromBytes } from '../../../shared/transfers/transfer-code';
import { completeVisitBody } from '../../../bench/lib/complete-visit-body';
import { draftVisit, memberInvitation, newAppliance, ok, shareLinkOn, spareTechnician, uniqueJpeg, type World } from './world';

/** Who calls. "other*" belong to a second company and name the first company's records. */
export const CALLERS = ['signedOut', 'owner', 'manager', 'technician', 'homeowner', 'linkHolder', 'otherManager', 'otherHomeowner'] as const;
export type CallerId = (typeof CALLERS)[number];

/** What one cell of the matrix sends: the records it names (target) and the links its caller holds (own). */
export type Cell = {
  target: World;
  /** Whose share or unsubscribe links the caller holds; null for someone who holds none. */
  own: World | null;
  fresh: Record<string, unknown>;
};
type Made = Record<string, unknown>;

export type RouteCase = {
  /** Records made anew for each cell in the target company, for routes that change a record for good. */
  freshInTarget?: (ctx: AppContext, target: World) => Promise<Made>;
  /** A link made anew for each cell in the caller's own company (null for a caller who holds none). */
  freshInOwn?: (ctx: AppContext, own: World | null) => Promise<Made>;
  params?: (c: Cell) => Record<string, string>;
  query?: (c: Cell) => Record<string, string>;
  body?: (c: Cell) => object;
  /** A multipart upload; `as` names the file's form field, name and type (default: a JPEG in `files`). */
  upload?: (c: Cell) => Promise<{ fields: Record<string, string>; file: Buffer; as?: { field: string; filename: string; contentType: string } }>;
  /** The answer to a caller of the target's own company whom the route's access lets through. */
  status: number;
  /** Callers answered otherwise, each for a reason given beside it. */
  as?: Partial<Record<CallerId, number>>;
  /** Another company's caller who passes the role check: 404 when the request names the target's records (the default when the path has a parameter). */
  crossTenant?: number;
};

const str = (v: unknown) => String(v);
const randomShareToken = () => crypto.randomBytes(32).toString('base64url');
const randomTransferCode = () => transferCodeFromBytes(crypto.randomBytes(16));
const PAST_DAY = '2024-03-01';
const serviceRequestBody = { contactName: 'Matrix caller', contactPhone: '555-0142', message: 'The radiators are cold upstairs.' };
/** A date some days ahead of the real clock (the matrix runs on it), as the company's calendar would write it. */
const daysAhead = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
/** Each booking the matrix makes gets an hour of its own, so no two clash for the one technician. */
let windowCounter = 0;
function nextWindow() {
  windowCounter += 1;
  const day = daysAhead(2 + Math.floor(windowCounter / 20));
  const hour = String(windowCounter % 20).padStart(2, '0');
  return { start: `${day}T${hour}:00`, end: `${day}T${hour}:45` };
}
async function freshBooking(ctx: AppContext, w: World) {
  const { start, end } = nextWindow();
  const booking = await insertBooking(ctx.db, {
    companyId: w.companyId,
    siteId: w.siteId,
    technicianId: w.tenant.technician.user.id,
    applianceIds: [w.applianceId],
    start,
    end,
  });
  return { bookingId: booking.id };
}
/** The signed link of a booking e-mail, for a fresh booking in the caller's own company; a forged one for a caller who holds none. */
async function bookingReplyLink(ctx: AppContext, own: World | null) {
  if (!own) return { token: `${crypto.randomUUID()}.${randomShareToken()}` };
  const { bookingId } = await freshBooking(ctx, own);
  return { token: bookingReplyToken(ctx.config.BETTER_AUTH_SECRET, bookingId) };
}
const uniqueEmail = (what: string) => `${what}-${crypto.randomUUID()}@example.test`;

async function visitOnNewAppliance(ctx: AppContext, w: World, components: Parameters<typeof newAppliance>[2] = []) {
  const appliance = await newAppliance(ctx, w, components);
  return { appliance, visit: await draftVisit(w, appliance.id) };
}

/** One completed visit on the world's shared boiler (made once per world): the visit reports read it. */
const completedVisits = new WeakMap<World, Promise<string>>();
function completedVisitOn(w: World): Promise<string> {
  if (!completedVisits.has(w)) {
    completedVisits.set(
      w,
      (async () => {
        const visit = await draftVisit(w, w.applianceId, w.as.manager);
        await ok('complete', w.as.manager.post(`/api/visits/${visit.id}/complete`).send(completeVisitBody(visit)));
        return visit.id;
      })(),
    );
  }
  return completedVisits.get(w)!;
}

/**
 * The expectation of every route in routeTable, keyed `method path`. A route without one fails the matrix test.
 * Bodies are valid and harmless (or act on records made for the cell), so a permitted caller's answer is the
 * route's real success, and another company's caller reaches the record lookup (404) rather than validation (400).
 */
export const ROUTE_CASES: Record<string, RouteCase> = {
  'get /health': { status: 200 },
  'get /me': { status: 200 },
  'get /company': { status: 200 },
  // An empty patch is a 400 (nonEmptyPatch); the time zone every test company has already changes nothing.
  'patch /company': { body: () => ({ timeZone: 'America/New_York' }), status: 200 },
  'get /members': { status: 200 },
  'patch /members/:id': { params: (c) => ({ id: c.target.tenant.technician.membership.id }), body: () => ({ role: 'technician' }), status: 200 },
  'post /members/:id/deactivate': {
    freshInTarget: async (ctx, w) => ({ membershipId: await spareTechnician(ctx, w) }),
    params: (c) => ({ id: str(c.fresh.membershipId) }),
    status: 200,
  },
  'get /search': { query: (c) => ({ q: c.target.tenant.customer.name.slice(0, 6) }), status: 200 },
  'get /customers': { status: 200 },
  'post /customers': { body: () => ({ name: 'Matrix Customer' }), status: 201 },
  'get /customers/:id': { params: (c) => ({ id: c.target.tenant.customer.id }), status: 200 },
  'patch /customers/:id': { params: (c) => ({ id: c.target.tenant.customer.id }), body: () => ({ notes: 'Seen by the authorization matrix.' }), status: 200 },
  // A form field naming another company's record is a field error, worded as for a record that does not exist.
  'post /sites': { body: (c) => ({ customerId: c.target.tenant.customer.id, street: '1 Matrix Row', town: 'Wrenfield' }), status: 201, crossTenant: 400 },
  'patch /sites/:id': { params: (c) => ({ id: c.target.siteId }), body: () => ({ accessNotes: 'Side door.' }), status: 200 },
  // As for sites: the site field naming another company's site is a field error.
  'post /appliances': {
    body: (c) => ({ siteId: c.target.siteId, kind: 'hot_water_boiler', fuel: 'natural_gas', construction: 'cast_iron', ignitionType: 'direct_spark', ventType: 'power_vent' }),
    status: 201,
    crossTenant: 400,
  },
  'get /appliances/:id': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  'patch /appliances/:id': { params: (c) => ({ id: c.target.applianceId }), body: () => ({ location: 'Basement' }), status: 200 },
  'post /appliances/:id/replace': {
    freshInTarget: async (ctx, w) => ({ oldId: (await newAppliance(ctx, w)).id, newId: (await newAppliance(ctx, w)).id }),
    params: (c) => ({ id: str(c.fresh.oldId) }),
    body: (c) => ({ newApplianceId: c.fresh.newId, removedOn: PAST_DAY }),
    status: 200,
  },
  'post /appliances/:id/components': {
    params: (c) => ({ id: c.target.applianceId }),
    body: () => ({ typeCode: 'thermocouple', spec: { lengthIn: 30 }, installedOn: PAST_DAY }),
    status: 201,
  },
  'get /appliances/:id/timeline': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  // The history of changes is the office's (records:history): technicians and homeowners get 403.
  'get /appliances/:id/changes': { params: (c) => ({ id: c.target.applianceId }), query: () => ({ limit: '10' }), status: 200 },
  'get /catalog/component-types': { status: 200 },
  // Part-type codes are the same words in every company; each company changes its own catalog entry.
  'patch /catalog/component-types/:code': { params: (c) => ({ code: c.target.catalogCode }), body: () => ({ active: true }), status: 200, crossTenant: 200 },
  'get /checklist-templates': { status: 200 },
  'put /checklist-templates/:id': { params: (c) => ({ id: c.target.checklistTemplate.id }), body: (c) => c.target.checklistTemplate.body, status: 200 },
  'post /visits': { body: (c) => ({ applianceId: c.target.spareApplianceId, type: 'repair' }), status: 200, crossTenant: 404 },
  'get /visits/:id': { params: (c) => ({ id: c.target.visitId }), status: 200 },
  'get /visits/:id/changes': { params: (c) => ({ id: c.target.visitId }), query: () => ({ limit: '10' }), status: 200 },
  'put /visits/:id/draft': {
    freshInTarget: async (ctx, w) => ({ visitId: (await visitOnNewAppliance(ctx, w)).visit.id }),
    params: (c) => ({ id: str(c.fresh.visitId) }),
    body: () => ({ revision: 0, findings: 'Draft from the matrix.' }),
    status: 200,
  },
  'post /visits/:id/swaps': {
    freshInTarget: async (ctx, w) => {
      const { appliance, visit } = await visitOnNewAppliance(ctx, w, [{ typeCode: 'thermocouple', spec: { lengthIn: 24 } }]);
      return { visitId: visit.id, componentId: appliance.components[0].id };
    },
    params: (c) => ({ id: str(c.fresh.visitId) }),
    body: (c) => ({ componentId: c.fresh.componentId, reason: 'Worn out.' }),
    status: 200,
  },
  'post /visits/:id/complete': {
    freshInTarget: async (ctx, w) => {
      const { visit } = await visitOnNewAppliance(ctx, w);
      return { visitId: visit.id, body: completeVisitBody(visit) };
    },
    params: (c) => ({ id: str(c.fresh.visitId) }),
    body: (c) => c.fresh.body as object,
    status: 200,
  },
  // The visit's own technician may correct it, as may owners and managers (visits:amend-any).
  'post /visits/:id/amendments': {
    freshInTarget: async (ctx, w) => {
      const { visit } = await visitOnNewAppliance(ctx, w);
      await ok('complete', w.as.technician.post(`/api/visits/${visit.id}/complete`).send(completeVisitBody(visit)));
      return { visitId: visit.id };
    },
    params: (c) => ({ id: str(c.fresh.visitId) }),
    body: () => ({ reason: 'Corrected the findings.', findings: 'Corrected by the matrix.' }),
    status: 200,
  },
  'get /due-rules': { status: 200 },
  'put /due-rules/:id': { params: (c) => ({ id: c.target.dueRule.id }), body: (c) => c.target.dueRule.body, status: 200 },
  'get /service-life': { status: 200 },
  // The matrix's companies have too few worn-out parts to adopt a learned life: a caller let through meets that 400.
  'post /due-rules/:id/adopt-learned-life': { params: (c) => ({ id: c.target.dueRule.id }), status: 400 },
  'get /due': { status: 200 },
  'get /due/export.csv': { status: 200 },
  'get /due/stock': { status: 200 },
  'get /appliances/:id/makeup-water': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  'post /appliances/:id/makeup-water': {
    params: (c) => ({ id: c.target.applianceId }),
    body: () => ({ kind: 'added_by_hand', recordedOn: PAST_DAY, gallons: 1 }),
    status: 201,
  },
  'get /appliances/:id/radiation-surveys': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  'get /appliances/:id/radiation-surveys/latest': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  'post /appliances/:id/radiation-surveys': {
    params: (c) => ({ id: c.target.applianceId }),
    body: () => ({ surveyedOn: PAST_DAY, system: 'steam', rooms: [{ name: 'Parlour', radiators: [{ type: 'cast_iron_column', columns: 3, heightIn: 38, sections: 10 }] }] }),
    status: 201,
  },
  'post /appliances/:id/share-links': { params: (c) => ({ id: c.target.applianceId }), body: () => ({}), status: 201 },
  'get /appliances/:id/share-links': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  'post /share-links/:id/revoke': {
    freshInTarget: async (_ctx, w) => ({ linkId: (await shareLinkOn(w)).id }),
    params: (c) => ({ id: str(c.fresh.linkId) }),
    status: 200,
  },
  // The token is the key: anyone holding a live link reads it; a stranger's guess is 404; another company's caller opens their own link.
  'get /share/:token': { params: (c) => ({ token: c.own?.shareToken ?? randomShareToken() }), status: 200, as: { signedOut: 404 }, crossTenant: 200 },
  'post /appliances/:id/record-transfers': { params: (c) => ({ id: c.target.applianceId }), status: 201 },
  'get /appliances/:id/record-transfers': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  'post /record-transfers/:id/withdraw': {
    freshInTarget: async (_ctx, w) => ({ id: (await ok<{ id: string }>('transfer code', w.as.manager.post(`/api/appliances/${w.applianceId}/record-transfers`))).id }),
    params: (c) => ({ id: str(c.fresh.id) }),
    status: 200,
  },
  'post /homeowner/appliances/:id/record-transfers': { params: (c) => ({ id: c.target.applianceId }), status: 201 },
  'post /homeowner/record-transfers/:id/withdraw': {
    freshInTarget: async (_ctx, w) => ({ id: (await ok<{ id: string }>('transfer code', w.as.homeowner.post(`/api/homeowner/appliances/${w.applianceId}/record-transfers`))).id }),
    params: (c) => ({ id: str(c.fresh.id) }),
    status: 200,
  },
  // A code no one issued: the matrix proves who gets past the guard; tests/api/record-transfers.test.ts the rest.
  'post /record-transfers/preview': { body: () => ({ code: randomTransferCode() }), status: 404 },
  'post /record-transfers/redeem': { body: () => ({ code: randomTransferCode() }), status: 404 },
  'get /homeowner/appliances': { status: 200 },
  'get /homeowner/appliances/:id': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  'get /fleet/annual-service-due': { status: 200 },
  'get /fleet/replacement-prospects': { status: 200 },
  'post /tag-batches': { body: () => ({ count: 1, format: 'single_large' }), status: 201 },
  'get /tag-batches': { status: 200 },
  'get /tag-batches/:id/pdf': { params: (c) => ({ id: c.target.tagBatchId }), status: 200 },
  'post /tags/assign': {
    freshInTarget: async (ctx, w) => {
      const batch = await ok<{ codes: string[] }>('tag batch', w.as.manager.post('/api/tag-batches').send({ count: 1, format: 'single_large' }));
      return { code: batch.codes[0], applianceId: (await newAppliance(ctx, w)).id };
    },
    body: (c) => ({ code: c.fresh.code, applianceId: c.fresh.applianceId }),
    status: 200,
    crossTenant: 404,
  },
  'get /appliances/:id/tags': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  // Members see any of their company's tags; the homeowner this one, because it is on their own boiler.
  'get /tags/:code/resolve': { params: (c) => ({ code: c.target.tagCode }), status: 200 },
  // What a stranger who scans a sticker learns: the company's name and phone, by design, from anyone.
  'get /public/tags/:code': { params: (c) => ({ code: c.target.tagCode }), status: 200, crossTenant: 200 },
  'post /visits/arrive-by-tag': { body: (c) => ({ code: c.target.tagCode, type: 'repair' }), status: 200, crossTenant: 404 },
  'post /photos': {
    upload: async (c) => ({ fields: { applianceId: c.target.applianceId, kind: 'finding', caption: 'Matrix upload' }, file: await uniqueJpeg() }),
    status: 201,
    crossTenant: 404,
  },
  'get /photos': { query: (c) => ({ applianceId: c.target.applianceId }), status: 200, crossTenant: 404 },
  // Members with records:read, and the homeowner for a photo of their own appliance marked for them.
  'get /photos/:id/display': { params: (c) => ({ id: c.target.photoId }), status: 200 },
  'get /photos/:id/thumb': { params: (c) => ({ id: c.target.photoId }), status: 200 },
  'patch /photos/:id': { params: (c) => ({ id: c.target.photoId }), body: () => ({ caption: 'Rating plate' }), status: 200 },
  'post /imports': {
    upload: async () => ({
      fields: {},
      file: Buffer.from(`Customer,Street,Town,Kind,Fuel\nUpload ${crypto.randomUUID()},2 Matrix Row,Wrenfield,Steam,Gas\n`),
      as: { field: 'file', filename: 'matrix.csv', contentType: 'text/csv' },
    }),
    status: 201,
  },
  'get /imports': { status: 200 },
  'get /imports/:id': { params: (c) => ({ id: c.target.importId }), status: 200 },
  'post /imports/:id/preview': {
    params: (c) => ({ id: c.target.importId }),
    body: () => ({ mapping: { customerName: 'Customer', siteStreet: 'Street', siteTown: 'Town', applianceKind: 'Kind', fuel: 'Fuel' } }),
    status: 200,
  },
  // A run without the required columns: the office's caller reaches validation, and nothing is imported by the matrix.
  'post /imports/:id/run': { params: (c) => ({ id: c.target.importId }), body: () => ({ mapping: {} }), status: 400 },
  'get /imports/:id/errors.csv': { params: (c) => ({ id: c.target.importId }), status: 200 },
  'post /team/invitations': { body: () => ({ email: uniqueEmail('invitee'), role: 'technician' }), status: 201 },
  'get /team/invitations': { status: 200 },
  'post /team/invitations/:id/revoke': {
    freshInTarget: async (_ctx, w) => ({ invitationId: await memberInvitation(w) }),
    params: (c) => ({ id: str(c.fresh.invitationId) }),
    status: 200,
  },
  'post /team/invitations/:id/resend': { params: (c) => ({ id: c.target.invitationForNobodyId }), status: 200 },
  'post /customers/:id/homeowner-invitation': { params: (c) => ({ id: c.target.tenant.customer.id }), body: () => ({ email: uniqueEmail('household') }), status: 201 },
  // Only the invited address sees an invitation; for anyone else it does not exist (404), in any company.
  'get /invitations/:id': { params: (c) => ({ id: c.target.invitationForHomeownerId }), status: 404, as: { homeowner: 200 } },
  'post /invitations/:id/accept': { params: (c) => ({ id: c.target.invitationForNobodyId }), body: () => ({}), status: 404 },
  'post /reminders/annual-service/:applianceId': {
    freshInTarget: async (ctx, w) => ({ applianceId: (await newAppliance(ctx, w)).id }),
    params: (c) => ({ applianceId: str(c.fresh.applianceId) }),
    status: 201,
  },
  'get /reminders': { status: 200 },
  // The link in the e-mail is the key, as with share links.
  'get /unsubscribe/:token': { params: (c) => ({ token: c.own?.unsubscribeToken ?? `${crypto.randomUUID()}.${randomShareToken()}` }), status: 200, as: { signedOut: 404 }, crossTenant: 200 },
  'post /unsubscribe/:token': { params: (c) => ({ token: c.own?.unsubscribeToken ?? `${crypto.randomUUID()}.${randomShareToken()}` }), status: 200, as: { signedOut: 404 }, crossTenant: 200 },
  'get /dev/outbox': { status: 200 },
  // The signed link in a booking e-mail is the key, as with share links; a fresh booking per cell keeps the daily limit out of it.
  'get /booking-reply/:token': { freshInOwn: bookingReplyLink, params: (c) => ({ token: str(c.fresh.token) }), status: 200, as: { signedOut: 404 }, crossTenant: 200 },
  'post /booking-reply/:token': {
    freshInOwn: bookingReplyLink,
    params: (c) => ({ token: str(c.fresh.token) }),
    body: () => ({ contactName: 'Matrix caller', reason: 'At work then', preferredTimes: 'Weekday afternoons' }),
    status: 201,
    as: { signedOut: 404 },
    crossTenant: 201,
  },
  // A live link opens its own appliance's homeowner-visible photos; another company's link never opens this one.
  'get /share/:token/photos/:photoId/:variant': {
    params: (c) => ({ token: c.own?.shareToken ?? randomShareToken(), photoId: c.target.photoId, variant: 'thumb' }),
    status: 200,
    as: { signedOut: 404 },
  },
  'get /homeowner/appliances/:id/photos/:photoId/:variant': { params: (c) => ({ id: c.target.applianceId, photoId: c.target.photoId, variant: 'thumb' }), status: 200 },
  // A new link per cell, so the daily limit per link never decides the answer.
  'post /share/:token/service-requests': {
    freshInOwn: async (_ctx, own) => ({ token: own ? (await shareLinkOn(own)).token : randomShareToken() }),
    params: (c) => ({ token: str(c.fresh.token) }),
    body: () => serviceRequestBody,
    status: 201,
    as: { signedOut: 404 },
    crossTenant: 201,
  },
  'post /homeowner/appliances/:id/service-requests': { params: (c) => ({ id: c.target.applianceId }), body: () => serviceRequestBody, status: 201 },
  'get /service-requests': { status: 200 },
  'get /appliances/:id/life-record.json': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  'get /appliances/:id/life-record.pdf': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  'get /homeowner/appliances/:id/life-record.json': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  'get /homeowner/appliances/:id/life-record.pdf': { params: (c) => ({ id: c.target.applianceId }), status: 200 },
  // As the share page itself: a live link exports its own appliance; another company's caller exports their own.
  'get /share/:token/life-record.json': { params: (c) => ({ token: c.own?.shareToken ?? randomShareToken() }), status: 200, as: { signedOut: 404 }, crossTenant: 200 },
  'get /share/:token/life-record.pdf': { params: (c) => ({ token: c.own?.shareToken ?? randomShareToken() }), status: 200, as: { signedOut: 404 }, crossTenant: 200 },
  'get /visits/:id/report': {
    freshInTarget: async (_ctx, w) => ({ visitId: await completedVisitOn(w) }),
    params: (c) => ({ id: str(c.fresh.visitId) }),
    status: 200,
  },
  'post /visits/:id/report/email': {
    freshInTarget: async (_ctx, w) => ({ visitId: await completedVisitOn(w) }),
    params: (c) => ({ id: str(c.fresh.visitId) }),
    status: 200,
  },
  // The link opens its own appliance's visit reports only: another company's link never opens this visit's.
  'get /share/:token/visits/:visitId/report': {
    freshInTarget: async (_ctx, w) => ({ visitId: await completedVisitOn(w) }),
    params: (c) => ({ token: c.own?.shareToken ?? randomShareToken(), visitId: str(c.fresh.visitId) }),
    status: 200,
    as: { signedOut: 404 },
  },
  'get /homeowner/appliances/:id/visits/:visitId/report': {
    freshInTarget: async (_ctx, w) => ({ visitId: await completedVisitOn(w) }),
    params: (c) => ({ id: c.target.applianceId, visitId: str(c.fresh.visitId) }),
    status: 200,
  },
  'patch /service-requests/:id': { params: (c) => ({ id: c.target.serviceRequestId }), body: () => ({ status: 'scheduled' }), status: 200 },
  'post /bookings': {
    body: (c) => ({ applianceIds: [c.target.spareApplianceId], technicianId: c.target.tenant.technician.user.id, ...nextWindow(), source: 'phone' }),
    status: 201,
    crossTenant: 404,
  },
  'get /bookings': { query: () => ({ from: daysAhead(1), to: daysAhead(7) }), status: 200 },
  'get /bookings/unbooked': { query: () => ({ from: daysAhead(1), to: daysAhead(7) }), status: 200 },
  'get /bookings/:id': { freshInTarget: freshBooking, params: (c) => ({ id: str(c.fresh.bookingId) }), status: 200 },
  'post /bookings/:id/move': { freshInTarget: freshBooking, params: (c) => ({ id: str(c.fresh.bookingId) }), body: () => nextWindow(), status: 200 },
  'post /bookings/:id/confirm': { freshInTarget: freshBooking, params: (c) => ({ id: str(c.fresh.bookingId) }), status: 200 },
  'post /bookings/:id/cancel': { freshInTarget: freshBooking, params: (c) => ({ id: str(c.fresh.bookingId) }), body: () => ({ reason: 'Customer away' }), status: 200 },
  'post /bookings/:id/no-access': { freshInTarget: freshBooking, params: (c) => ({ id: str(c.fresh.bookingId) }), body: () => ({ reason: 'Nobody home' }), status: 200 },
  'get /rounds': { query: () => ({ date: daysAhead(1) }), status: 200 },
  'get /load-list': { query: () => ({ from: daysAhead(1), to: daysAhead(7) }), status: 200 },
};
