/**
 * Every route that takes a body gets a seeded batch of hostile bodies: wrong types, nulls, huge strings, deep
 * nesting, __proto__ and constructor keys, NUL and lone surrogates inside otherwise valid bodies, bodies that are
 * not JSON. None may answer 5xx, and a refused (4xx) request must write no row: a trigger on every table of the
 * public schema counts rows inserted, updated and deleted (stricter than comparing row counts, which an update or
 * an insert plus a delete would pass). The app runs on a database of its own, so no other test file's writes count.
 */
import fc from 'fast-check';
import sharp from 'sharp';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import http from 'node:http';
import { createApp } from '../../server/app';
import { buildContext, closeContext } from '../../server/build-context';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import type { Mail } from '../../server/lib/mailer';
import { createLogger } from '../../server/logger';
import { routeTable, type RouteEntry } from '../../server/lib/route';
import { MULTIPART_BODY } from '../../server/middleware/body-type';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { insertBooking } from '../../server/db/factories/bookings';
import { bookingReplyToken } from '../../server/modules/booking-notices/booking-reply-token';
import { recordTransfers } from '../../server/db/schema/index';
import { hashTransferCode } from '../../server/modules/record-transfers/record-transfers.service';
import { testConfig } from '../support/context';
import { createOwnDatabase } from '../support/own-database';
import { installWriteCounter } from '../support/write-counter';
import { createTenant, type Agent, type Tenant } from '../support/tenant';
import { fullCompletion } from '../support/visit-completion';
import type { VisitDto } from '../../shared/schemas/visits';

const RUNS_PER_ROUTE = 200;
const SEED = 20_261_202;

// At the top, not in beforeAll: the routes must be in the route table when the tests below are listed.
const own = await createOwnDatabase('lifeplate_hostile');
// Mail is recorded, not sent: what the e-mails say is tested elsewhere, and an SMTP round trip per accepted
// invitation would be most of this file's run time.
const mails: string[] = [];
const mailer = { send: async (mail: Mail) => (mails.push(mail.to), { messageId: `<${mails.length}@hostile.test>`, accepted: [mail.to] }), close() {} };
const ctx = buildContext(testConfig({ DATABASE_URL: own.url }), { logger: createLogger('silent'), mailer });
const app = createApp(ctx);
// One listening server, so each request reuses a kept-alive connection instead of starting a server of its own.
const server = http.createServer(app);
await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
let t: Tenant;
let as: { owner: Agent; homeowner: Agent };
let rowsWritten: () => Promise<number>;
let paths: Record<string, string>;
let samples: Record<string, Record<string, unknown>>;
/** Read routes whose query is fuzzed below (GET routes take no body): the history of changes. */
const QUERY_ROUTES = ['get /appliances/:id/changes', 'get /visits/:id/changes'];
let queryPaths: Record<string, string>;
const sent = { bodies: 0, refused: 0, accepted: 0, queries: 0, startedAt: 0 };

/** Setup that must work, or the fuzzing below would prove nothing. */
async function ok<T extends { status: number; body: unknown }>(res: Promise<T> | T, what: string): Promise<T> {
  const r = await res;
  if (r.status >= 300) throw new Error(`${what}: ${r.status} ${JSON.stringify(r.body)}`);
  return r;
}

beforeAll(async () => {
  t = await createTenant(ctx.db);
  as = { owner: await signIn(t.owner.user.email), homeowner: await signIn(t.homeowner.user.email) };

  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
  const parts = [{ typeCode: 'thermocouple' as const, installedOn: '2020-01-01', spec: { lengthIn: 24 } }];
  const boiler = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, components: parts });
  const spare = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id });
  const started: VisitDto[] = [];
  const visit = async (type: string) => {
    const dto = (await ok(as.owner.post('/api/visits').send({ applianceId: boiler.id, type }), 'start a visit')).body as VisitDto;
    started.push(dto);
    return dto.id;
  };
  const [draftVisit, swapVisit, completeVisit, amendVisit] = [await visit('repair'), await visit('repair'), await visit('repair'), await visit('repair')];
  const toAmend = started[3];
  await ok(as.owner.post(`/api/visits/${amendVisit}/complete`).send(fullCompletion(toAmend, { findings: 'Cleaned the burners.' })), 'complete a visit');
  const link = await ok(as.owner.post(`/api/appliances/${boiler.id}/share-links`).send({ label: 'for the owner' }), 'make a share link');
  const token = link.body.url.split('/s/')[1];
  const tags = await ok(as.owner.post('/api/tag-batches').send({ count: 2, format: 'single_large' }), 'make tags');
  const [freeTag, boilerTag] = tags.body.codes as string[];
  await ok(as.owner.post('/api/tags/assign').send({ code: boilerTag, applianceId: spare.id }), 'tag an appliance');
  const jpeg = await sharp({ create: { width: 40, height: 30, channels: 3, background: { r: 80, g: 80, b: 80 } } }).jpeg().toBuffer();
  // A month ahead of the real clock, on the company's wall clock (New York): bookings refuse the past.
  const ahead = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);
  const booking = await insertBooking(ctx.db, {
    companyId: t.company.id,
    siteId: site.id,
    technicianId: t.technician.user.id,
    applianceIds: [boiler.id],
    start: `${ahead}T08:00`,
    end: `${ahead}T09:00`,
  });
  // A booking of its own for the homeowner's reply, so the cancel route's fuzzing does not close it.
  const replyBooking = await insertBooking(ctx.db, {
    companyId: t.company.id,
    siteId: site.id,
    technicianId: t.owner.user.id,
    applianceIds: [boiler.id],
    start: `${ahead}T13:00`,
    end: `${ahead}T14:00`,
  });
  const photo = await ok(
    as.owner.post('/api/photos').field('applianceId', boiler.id).field('kind', 'nameplate').attach('files', jpeg, { filename: 'p.jpg', contentType: 'image/jpeg' }),
    'upload a photo',
  );
  const serviceRequest = { contactName: 'Ada Fenwick', contactPhone: '555-0142', message: 'No heat upstairs' };
  const requested = await ok(as.homeowner.post(`/api/homeowner/appliances/${boiler.id}/service-requests`).send(serviceRequest), 'request service');
  const importFile = await ok(
    as.owner.post('/api/imports').attach('file', Buffer.from('Customer,Street,Town,Kind,Fuel\nIda Quell,5 Marsh Row,Wrenfield,Steam,Gas\n'), { filename: 'f.csv', contentType: 'text/csv' }),
    'upload an import file',
  );
  const [rule] = (await ok(as.owner.get('/api/due-rules'), 'read the due rules')).body;
  const [template] = (await ok(as.owner.get('/api/checklist-templates'), 'read the checklists')).body;

  // A transfer code from a second company, so the receiving routes meet a code they could really redeem.
  const sender = await createTenant(ctx.db);
  const senderSite = await insertSite(ctx.db, { companyId: sender.company.id, customerId: sender.customer.id });
  const senderBoiler = await insertAppliance(ctx.db, { companyId: sender.company.id, siteId: senderSite.id });
  const transferCode = 'K7M2Q9XD4HPTWB3C';
  await ctx.db.insert(recordTransfers).values({
    companyId: sender.company.id,
    applianceId: senderBoiler.id,
    codeHash: hashTransferCode(transferCode),
    madeBy: 'office',
    expiresAt: new Date(Date.now() + 14 * 86_400_000),
  });

  // Installed after the setup above, so it counts only what the hostile requests write; and it does count.
  rowsWritten = await installWriteCounter(ctx.db);
  const start = await rowsWritten();
  await ok(as.owner.post('/api/customers').send({ name: 'Counter Check' }), 'write a customer');
  if ((await rowsWritten()) < start + 2) throw new Error('the write counter missed the customer and its audit row');
  paths = {
    'post /customers': '/customers',
    'patch /customers/:id': `/customers/${t.customer.id}`,
    'post /sites': '/sites',
    'patch /sites/:id': `/sites/${site.id}`,
    'post /appliances': '/appliances',
    'patch /appliances/:id': `/appliances/${boiler.id}`,
    'post /appliances/:id/replace': `/appliances/${spare.id}/replace`,
    'post /appliances/:id/components': `/appliances/${boiler.id}/components`,
    'patch /catalog/component-types/:code': '/catalog/component-types/thermocouple',
    'put /checklist-templates/:id': `/checklist-templates/${template.id}`,
    'patch /company': '/company',
    'patch /members/:id': `/members/${t.technician.membership.id}`,
    'put /due-rules/:id': `/due-rules/${rule.id}`,
    'post /appliances/:id/makeup-water': `/appliances/${boiler.id}/makeup-water`,
    'post /appliances/:id/radiation-surveys': `/appliances/${boiler.id}/radiation-surveys`,
    'post /appliances/:id/share-links': `/appliances/${boiler.id}/share-links`,
    'post /share/:token/service-requests': `/share/${token}/service-requests`,
    'post /homeowner/appliances/:id/service-requests': `/homeowner/appliances/${boiler.id}/service-requests`,
    'patch /service-requests/:id': `/service-requests/${requested.body.id}`,
    'post /tag-batches': '/tag-batches',
    'post /tags/assign': '/tags/assign',
    'post /visits/arrive-by-tag': '/visits/arrive-by-tag',
    'post /visits': '/visits',
    'put /visits/:id/draft': `/visits/${draftVisit}/draft`,
    'post /visits/:id/swaps': `/visits/${swapVisit}/swaps`,
    'post /visits/:id/complete': `/visits/${completeVisit}/complete`,
    'post /visits/:id/amendments': `/visits/${amendVisit}/amendments`,
    'post /photos': '/photos',
    'post /imports/:id/preview': `/imports/${importFile.body.id}/preview`,
    'post /imports/:id/run': `/imports/${importFile.body.id}/run`,
    'patch /photos/:id': `/photos/${photo.body.photos[0].id}`,
    'post /team/invitations': '/team/invitations',
    'post /customers/:id/homeowner-invitation': `/customers/${t.customer.id}/homeowner-invitation`,
    // Nobody has invited the owner: a body that passes validation meets 404, which is as good a place to end.
    'post /invitations/:id/accept': `/invitations/${crypto.randomUUID()}/accept`,
    'post /bookings': '/bookings',
    'post /bookings/:id/move': `/bookings/${booking.id}/move`,
    'post /bookings/:id/cancel': `/bookings/${booking.id}/cancel`,
    'post /bookings/:id/no-access': `/bookings/${booking.id}/no-access`,
    'post /booking-reply/:token': `/booking-reply/${bookingReplyToken(ctx.config.BETTER_AUTH_SECRET, replyBooking.id)}`,
    'post /record-transfers/preview': '/record-transfers/preview',
    'post /record-transfers/redeem': '/record-transfers/redeem',
  };
  queryPaths = {
    'get /appliances/:id/changes': `/appliances/${boiler.id}/changes`,
    'get /visits/:id/changes': `/visits/${amendVisit}/changes`,
  };
  // One valid body per route: the mutations below break it one piece at a time.
  samples = {
    'post /customers': { name: 'Hollis Brae', kind: 'landlord', phone: '555-0101', email: 'hollis@example.test', remindersOptOut: false, notes: 'Side door' },
    'patch /customers/:id': { notes: 'Side door', remindersOptOut: true },
    'post /sites': { customerId: t.customer.id, street: '3 Marsh Row', town: 'Wrenfield', postalCode: '01234', accessNotes: 'Gate on the left' },
    'patch /sites/:id': { accessNotes: 'Gate on the left', town: 'Wrenfield' },
    'post /appliances': {
      siteId: site.id,
      kind: 'hot_water_boiler',
      fuel: 'natural_gas',
      construction: 'cast_iron',
      ignitionType: 'hot_surface',
      ventType: 'power_vent',
      manufacturer: 'Brightwell',
      inputBtuh: 105000,
      components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 }, originalWithAppliance: true, note: 'original' }],
    },
    'patch /appliances/:id': { location: 'Cellar', burnerCount: 3 },
    'post /appliances/:id/replace': { newApplianceId: boiler.id, removedOn: '2024-05-01', reason: 'Cracked section' },
    'post /appliances/:id/components': { typeCode: 'thermocouple', spec: { lengthIn: 30 }, installedOn: '2023-04-01', note: 'spare' },
    'patch /catalog/component-types/:code': { label: 'Thermocouple', active: true },
    'put /checklist-templates/:id': { name: 'Annual check', items: [{ key: 'burners', section: 'Burner', label: 'Clean the burners', readings: ['co'] }] },
    'patch /company': { phone: '555-0100', timeZone: 'America/Chicago', underFiringTolerancePct: 10, dueSoonDays: 45 },
    'patch /members/:id': { role: 'technician' },
    'put /due-rules/:id': {
      inspectionIntervalMonths: rule.inspectionIntervalMonths,
      replacementAgeYears: rule.replacementAgeYears,
      replacementPolicy: rule.replacementPolicy,
      basis: rule.basis,
      source: 'common practice',
    },
    'post /appliances/:id/makeup-water': { kind: 'added_by_hand', recordedOn: '2024-01-10', gallons: 2, note: 'topped up' },
    'post /appliances/:id/radiation-surveys': {
      surveyedOn: '2024-01-10',
      system: 'steam',
      notes: 'one-pipe steam',
      rooms: [{ name: 'Front room', radiators: [{ type: 'tube', tubes: 4, heightIn: 32, sections: 8, count: 2 }, { type: 'convector', ratedEdrSqFt: 20 }] }],
    },
    'post /appliances/:id/share-links': { expiresInDays: 30, label: 'for the owner' },
    'post /share/:token/service-requests': serviceRequest,
    'post /homeowner/appliances/:id/service-requests': serviceRequest,
    'patch /service-requests/:id': { status: 'scheduled' },
    'post /tag-batches': { count: 1, format: 'single_large' },
    'post /tags/assign': { code: freeTag, applianceId: boiler.id, replaceDamaged: false },
    'post /visits/arrive-by-tag': { code: boilerTag, type: 'repair' },
    // id: the phone's own id for a visit it started offline (mutations make it a non-UUID, a number, an object).
    'post /visits': { id: '6f1c2d3e-4b5a-4c6d-8e7f-9a0b1c2d3e4f', applianceId: boiler.id, type: 'inspection', visitedOn: '2024-02-02' },
    'put /visits/:id/draft': {
      revision: 0,
      findings: 'Cleaned the burners',
      checklist: [{ key: 'burners', mark: 'done', note: 'ok' }],
      readings: { combustion: { o2Pct: 6, coPpm: 40, flueTempF: 400, airTempF: 70 }, gaugeGlassLevel: 'half' },
    },
    'post /visits/:id/swaps': { componentId: boiler.components[0].id, reason: 'worn', cause: 'wear_or_failure', newSpec: { lengthIn: 24 } },
    'post /visits/:id/complete': { revision: 0, findings: 'Left running', outcome: 'left_operating' },
    'post /visits/:id/amendments': { reason: 'Typo in the findings', findings: 'Cleaned the burners and the pilot' },
    'post /photos': { applianceId: boiler.id, kind: 'after', caption: 'After cleaning', homeownerVisible: 'true' },
    'patch /photos/:id': { caption: 'Rating plate', homeownerVisible: false },
    'post /imports/:id/preview': { mapping: { customerName: 'Customer', siteStreet: 'Street', siteTown: 'Town', applianceKind: 'Kind', fuel: 'Fuel' } },
    'post /imports/:id/run': { mapping: { customerName: 'Customer', siteStreet: 'Street', siteTown: 'Town', applianceKind: 'Kind', fuel: 'Fuel' } },
    'post /team/invitations': { email: 'new.hand@example.test', role: 'technician' },
    'post /customers/:id/homeowner-invitation': { email: 'home.owner@example.test' },
    'post /invitations/:id/accept': { name: 'Rowan Tarn' },
    'post /bookings': { applianceIds: [spare.id], technicianId: t.technician.user.id, start: `${ahead}T10:00`, end: `${ahead}T11:00`, source: 'phone' },
    'post /bookings/:id/move': { start: `${ahead}T08:00`, end: `${ahead}T09:30`, note: 'Ring twice' },
    'post /bookings/:id/cancel': { reason: 'Customer away' },
    'post /bookings/:id/no-access': { reason: 'Nobody home' },
    'post /booking-reply/:token': { contactName: 'Ada Fenwick', contactPhone: '555-0142', reason: 'At work that morning', preferredTimes: 'Weekday afternoons' },
    'post /record-transfers/preview': { code: 'k7m2-q9xd-4hpt-wb3c' },
    'post /record-transfers/redeem': { code: 'K7M2-Q9XD-4HPT-WB3C', siteId: site.id },
  };
}, 120_000);

afterAll(async () => {
  server.closeAllConnections();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  await closeContext(ctx);
  await own.drop();
  // The count is part of the claim: at least RUNS_PER_ROUTE bodies for every route with a body.
  const seconds = ((performance.now() - sent.startedAt) / 1000).toFixed(1);
  process.stdout.write(`hostile bodies: ${sent.bodies} sent in ${seconds} s, ${sent.refused} refused, ${sent.accepted} accepted, ${mails.length} e-mails\n`);
  process.stdout.write(`hostile queries: ${sent.queries} sent\n`);
});

async function signIn(email: string): Promise<Agent> {
  const agent = request.agent(server);
  await ok(agent.post('/api/auth/sign-in/email').send({ email, password: DEFAULT_TEST_PASSWORD }), `sign in as ${email}`);
  return agent;
}

const bodyRoutes = () => [...routeTable.values()].filter((r) => r.schemas.body).map((r) => `${r.method} ${r.path}`);

function agentFor(route: RouteEntry): Agent | ReturnType<typeof request> {
  if (route.access === 'public') return request(server);
  if (route.access === 'homeowner') return as.homeowner;
  return as.owner;
}

// ---- the hostile values -------------------------------------------------------------------------------------

/** JSON text sent as it is: nesting too deep to build as an object, and text that is not JSON at all. */
class RawJson {
  constructor(readonly text: string) {}
}
const HOSTILE_KEYS = ['__proto__', 'constructor', 'prototype', 'toString', 'a\u0000b', '\ud800', 'x\udfff', ''];
const loneSurrogate = fc.constantFrom('\ud800', '\udbff', '\udc00', '\udfff');
const unstorableChar = fc.oneof(fc.constant('\u0000'), loneSurrogate);
const anyUnit = fc.oneof({ weight: 8, arbitrary: fc.string({ unit: 'binary', minLength: 1, maxLength: 1 }) }, { weight: 1, arbitrary: loneSurrogate });
const deep = fc
  .tuple(fc.integer({ min: 20, max: 5_000 }), fc.boolean())
  .map(([depth, arrays]) => new RawJson(arrays ? `${'['.repeat(depth)}${']'.repeat(depth)}` : `${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}`));
// Past most fields' limits, past a form field's 8 KB, and past the 1 MB body limit (rarely: it is the slowest to send).
const huge = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom('x'.repeat(10_001), '\u00e9'.repeat(40_000)) },
  { weight: 1, arbitrary: fc.constant('x'.repeat(1_100_000)) },
);
const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constant(null),
  fc.boolean(),
  fc.oneof(fc.integer(), fc.double({ noNaN: true, noDefaultInfinity: true }), fc.constantFrom(0, -1, 1e308, Number.MAX_SAFE_INTEGER + 2)),
  fc.string({ unit: anyUnit, maxLength: 40 }),
  fc.tuple(fc.string({ maxLength: 10 }), unstorableChar, fc.string({ maxLength: 10 })).map(([a, bad, b]) => `${a}${bad}${b}`),
  huge,
  deep,
  fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 5 }),
  fc.jsonValue({ maxDepth: 3 }),
  fc.constant({}),
  fc.constant([]),
);

type Mutation =
  | { kind: 'set'; pick: number; value: unknown }
  | { kind: 'taint'; pick: number; at: number; bad: string }
  | { kind: 'key'; pick: number; key: string; value: unknown }
  | { kind: 'drop'; pick: number };
const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  fc.record({ kind: fc.constant('set' as const), pick: fc.nat(), value: hostileValue }),
  // A NUL or lone surrogate inside a string of the valid body (or in place of a non-string).
  fc.record({ kind: fc.constant('taint' as const), pick: fc.nat(), at: fc.nat(), bad: unstorableChar }),
  fc.record({ kind: fc.constant('key' as const), pick: fc.nat(), key: fc.constantFrom(...HOSTILE_KEYS), value: hostileValue }),
  fc.record({ kind: fc.constant('drop' as const), pick: fc.nat() }),
);
type Hostile = { body: unknown; contentType: 'json' | 'text' | 'raw' };
const hostileBody = (sample: Record<string, unknown>): fc.Arbitrary<Hostile> =>
  fc.oneof(
    { weight: 6, arbitrary: fc.array(mutation, { minLength: 1, maxLength: 3 }).map((ms) => ({ body: mutate(sample, ms), contentType: 'json' as const })) },
    { weight: 2, arbitrary: hostileValue.map((body) => ({ body: copy(body), contentType: 'json' as const })) },
    { weight: 1, arbitrary: fc.constantFrom('{', '{"a":', 'nul', '[1,]', '\u0000', '{"a":"\\ud800"}', '"\\u0000"').map((text) => ({ body: new RawJson(text), contentType: 'raw' as const })) },
    // The valid body itself as text/plain: must be refused (415), never run on defaults.
    { weight: 1, arbitrary: fc.constant({ body: sample, contentType: 'text' as const }) },
  );

const isRecord = (v: unknown): v is Record<string, unknown> => Boolean(v) && typeof v === 'object' && !Array.isArray(v) && !(v instanceof RawJson);

/** Every place in a JSON value: [container, key] pairs, the root first. */
function places(root: unknown): { parent: Record<string, unknown> | unknown[]; key: string | number }[] {
  const out: { parent: Record<string, unknown> | unknown[]; key: string | number }[] = [];
  const walk = (v: unknown) => {
    if (Array.isArray(v)) {
      v.forEach((item, i) => {
        out.push({ parent: v, key: i });
        walk(item);
      });
    } else if (isRecord(v)) {
      for (const k of Object.keys(v)) {
        out.push({ parent: v, key: k });
        walk(v[k]);
      }
    }
  };
  walk(root);
  return out;
}
const containers = (root: unknown) => [root, ...places(root).map((p) => (p.parent as Record<string, unknown>)[p.key])].filter(isRecord);

/** Sets an own property, even "__proto__", the way JSON.parse would. */
const define = (target: object, key: string | number, value: unknown) =>
  Object.defineProperty(target, key, { value, enumerable: true, writable: true, configurable: true });

/** A fresh copy of a generated value (fast-check may hand out the same object twice), raw pieces kept as they are. */
function copy(v: unknown): unknown {
  if (v instanceof RawJson) return v;
  if (Array.isArray(v)) return v.map(copy);
  if (v && typeof v === 'object') {
    const out = {};
    for (const k of Object.keys(v)) define(out, k, copy((v as Record<string, unknown>)[k]));
    return out;
  }
  return v;
}

function mutate(sample: Record<string, unknown>, ms: Mutation[]): unknown {
  const body = copy(sample);
  for (const m of ms) {
    const all = places(body);
    if (m.kind === 'key') {
      const objects = containers(body);
      define(objects[m.pick % objects.length] as object, m.key, copy(m.value));
      continue;
    }
    if (!all.length) continue;
    const { parent, key } = all[m.pick % all.length];
    const current = (parent as Record<string, unknown>)[key];
    if (m.kind === 'set') define(parent, key, copy(m.value));
    else if (m.kind === 'drop') {
      if (Array.isArray(parent)) parent.splice(Number(key), 1);
      else delete parent[key];
    }
    else {
      const text = typeof current === 'string' ? current : 'x';
      const at = m.at % (text.length + 1);
      define(parent, key, `${text.slice(0, at)}${m.bad}${text.slice(at)}`);
    }
  }
  return body;
}

/** JSON text of a value, own "__proto__" keys and raw pieces included. */
function toJson(v: unknown): string {
  if (v instanceof RawJson) return v.text;
  if (Array.isArray(v)) return `[${v.map(toJson).join(',')}]`;
  if (v && typeof v === 'object') return `{${Object.keys(v).map((k) => `${JSON.stringify(k)}:${toJson((v as Record<string, unknown>)[k])}`).join(',')}}`;
  return JSON.stringify(v) ?? 'null';
}

function send(route: RouteEntry, path: string, hostile: Hostile) {
  const agent = agentFor(route) as Agent;
  const req = agent[route.method](`/api${path}`);
  if (hostile.contentType === 'text') return req.set('Content-Type', 'text/plain').send(toJson(hostile.body));
  if (route.bodyTypes.includes(MULTIPART_BODY) && hostile.contentType === 'json' && hostile.body && typeof hostile.body === 'object' && !Array.isArray(hostile.body)) {
    // A form carries strings only: each field's value as text, a nested one as its JSON.
    let form = req;
    for (const [k, v] of Object.entries(hostile.body)) form = form.field(k, typeof v === 'string' ? v : toJson(v));
    return form;
  }
  return req.set('Content-Type', 'application/json').send(toJson(hostile.body));
}

describe('hostile bodies', () => {
  it('cover every route that takes a body', () => {
    sent.startedAt = performance.now();
    expect(bodyRoutes().sort()).toEqual(Object.keys(samples).sort());
    expect(Object.keys(paths).sort()).toEqual(Object.keys(samples).sort());
  });

  it.each(bodyRoutes())(
    '%s: no 5xx, and a refused body writes nothing',
    async (key) => {
      const route = routeTable.get(key)!;
      let before = await rowsWritten();
      await fc.assert(
        fc.asyncProperty(hostileBody(samples[key]), async (hostile) => {
          const res = await send(route, paths[key], hostile);
          const [prior, after] = [before, await rowsWritten()];
          before = after;
          sent.bodies += 1;
          const what = JSON.stringify({ route: key, status: res.status, body: toJson(hostile.body).slice(0, 300), answer: JSON.stringify(res.body).slice(0, 300) });
          expect(res.status, what).toBeLessThan(500);
          if (hostile.contentType === 'text') expect(res.status, what).toBe(415);
          if (res.status < 400) return void (sent.accepted += 1);
          sent.refused += 1;
          expect(after, what).toEqual(prior);
        }),
        { seed: SEED + [...key].reduce((h, c) => (h * 31 + c.charCodeAt(0)) | 0, 0), numRuns: RUNS_PER_ROUTE },
      );
    },
    60_000,
  );
});

// ---- hostile queries ----------------------------------------------------------------------------------------

/** A query value as it arrives: text of any kind (NUL, lone surrogates, huge), numbers past the limits, repeats. */
const hostileQueryValue: fc.Arbitrary<string | string[]> = fc.oneof(
  fc.string({ unit: anyUnit, maxLength: 40 }),
  fc.tuple(fc.string({ maxLength: 10 }), unstorableChar, fc.string({ maxLength: 10 })).map(([a, bad, b]) => `${a}${bad}${b}`),
  fc.constantFrom('x'.repeat(10_001), '-1', '0', '1e3', '9'.repeat(40), 'NaN', '', '[object Object]'),
  fc.integer().map(String),
  fc.double({ noNaN: true }).map(String),
  fc.array(fc.string({ maxLength: 5 }), { minLength: 2, maxLength: 3 }),
);
const hostileQuery = fc.dictionary(fc.oneof(fc.constantFrom('limit', 'cursor'), fc.constantFrom(...HOSTILE_KEYS)), hostileQueryValue, { maxKeys: 3 });

describe('hostile queries', () => {
  it('cover the history-of-changes routes, which exist and read a query', () => {
    expect(Object.keys(queryPaths).sort()).toEqual([...QUERY_ROUTES].sort());
    for (const key of QUERY_ROUTES) expect(routeTable.get(key)?.schemas.query, key).toBeDefined();
  });

  it.each(QUERY_ROUTES)(
    '%s: no 5xx and nothing written, and a valid query answers 200',
    async (key) => {
      const valid = await as.owner.get(`/api${queryPaths[key]}`).query({ limit: '5' });
      expect(valid.status).toBe(200);
      let before = await rowsWritten();
      await fc.assert(
        fc.asyncProperty(hostileQuery, async (query) => {
          const search = new URLSearchParams();
          for (const [k, v] of Object.entries(query)) for (const one of [v].flat()) search.append(k, one);
          const res = await as.owner.get(`/api${queryPaths[key]}?${search.toString()}`);
          const [prior, after] = [before, await rowsWritten()];
          before = after;
          sent.queries += 1;
          const what = JSON.stringify({ route: key, status: res.status, query: search.toString().slice(0, 300), answer: JSON.stringify(res.body).slice(0, 300) });
          expect(res.status, what).toBeLessThan(500);
          if (res.status === 400) expect(Object.keys(res.body.error.details ?? {}).length, what).toBeGreaterThan(0);
          expect(after, what).toEqual(prior);
        }),
        { seed: SEED + [...key].reduce((h, c) => (h * 31 + c.charCodeAt(0)) | 0, 0), numRuns: RUNS_PER_ROUTE },
      );
    },
    60_000,
  );
});
