import type { Faker } from '@faker-js/faker';
import type { Tx } from '../client';
import { appliances, components, customers, partSwaps, sites, timelineEvents, visits } from '../schema/index';
import { addDays, addYears } from '../../../shared/trade/iso-date';
import { recomputeDueForCompany } from '../../modules/due';
import { applianceLabel } from '../../modules/appliances';
import { fakerFor } from '../factories/faker';
import { INVENTED_NEIGHBOUR_TOWNS, INVENTED_TOWN } from '../factories/invented-names';
import { bulkInsert } from './bulk-insert';
import { DEMO_COMPANY, OTHER_COMPANY } from './demo-accounts';
import { buildDemoHistory, type DemoHistoryPlan, type DemoHistoryRows } from './demo-history';
import { planAppliance } from './demo-plan';
import { demoClock, type DemoClock } from './demo-clock';

type Ids = { demoCompanyId: string; otherCompanyId: string; homeownerCustomerId: string; userIds: Record<string, string> };
type CustomerRow = typeof customers.$inferInsert & { id: string };
type SiteRow = typeof sites.$inferInsert & { id: string };

const ACCESS_NOTES = ['Side door; key in the lockbox.', 'Call ahead: dog in the yard.', 'Boiler room through the garage.', 'Tenant works nights; come after 11.', null, null, null];

/** Collects every row first, then writes each table in a few multi-row inserts. */
class Batch {
  customers: CustomerRow[] = [];
  sites: SiteRow[] = [];
  appliances: (typeof appliances.$inferInsert)[] = [];
  history: DemoHistoryRows = { components: [], visits: [], swaps: [], events: [] };

  add(rows: DemoHistoryRows) {
    this.history.components.push(...rows.components);
    this.history.visits.push(...rows.visits);
    this.history.swaps.push(...rows.swaps);
    this.history.events.push(...rows.events);
  }

  async write(tx: Tx) {
    await bulkInsert(tx, customers, this.customers);
    await bulkInsert(tx, sites, this.sites);
    // A row may point at its successor (replaced_by_id); successors were added later, so write them first.
    await bulkInsert(tx, appliances, [...this.appliances].reverse());
    await bulkInsert(tx, components, [...this.history.components].reverse());
    await bulkInsert(tx, visits, this.history.visits, 200);
    await bulkInsert(tx, partSwaps, this.history.swaps);
    await bulkInsert(tx, timelineEvents, this.history.events);
  }
}

function newCustomer(f: Faker, companyId: string, kind: CustomerRow['kind'], clock: DemoClock): CustomerRow {
  const first = f.person.firstName();
  const last = f.person.lastName();
  return {
    id: f.string.uuid(),
    companyId,
    name: kind === 'property_manager' ? `${last} Property Care` : `${first} ${last}`,
    kind,
    phone: `555-${f.string.numeric(4)}`,
    email: `${first}.${last}`.toLowerCase().replace(/[^a-z.]/g, '') + '@example.test',
    remindersOptOut: f.datatype.boolean({ probability: 0.1 }),
    createdAt: clock.at(addDays(clock.today, -f.number.int({ min: 30, max: 3650 })), 10),
  };
}

function newSite(f: Faker, companyId: string, customerId: string, technicianId: string | null): SiteRow {
  return {
    id: f.string.uuid(),
    companyId,
    customerId,
    street: f.location.streetAddress(),
    town: f.datatype.boolean({ probability: 0.6 }) ? INVENTED_TOWN : f.helpers.arrayElement(INVENTED_NEIGHBOUR_TOWNS),
    accessNotes: f.helpers.arrayElement(ACCESS_NOTES),
    assignedTechnicianId: technicianId,
  };
}

function addBoiler(f: Faker, batch: Batch, plan: Omit<DemoHistoryPlan, 'lastDay'> & { lastDay?: string }, clock: DemoClock) {
  batch.appliances.push(plan.appliance);
  batch.add(buildDemoHistory(f, { lastDay: clock.today, ...plan }, clock));
}

function seedDemoCompany(f: Faker, batch: Batch, ids: Ids, clock: DemoClock) {
  const companyId = ids.demoCompanyId;
  const today = clock.today;
  const techs = [ids.userIds['tech@demo.test'], ids.userIds['tech2@demo.test']];
  const owner = ids.userIds['owner@demo.test'];

  // The homeowner's own record: an old cast-iron steam boiler on natural gas with a standing pilot.
  const homeSite = { ...newSite(f, companyId, ids.homeownerCustomerId, techs[0]), town: INVENTED_TOWN, accessNotes: 'Bulkhead door at the back.' };
  batch.sites.push(homeSite);
  const home = planAppliance(f, { companyId, siteId: homeSite.id, today, ageYears: 27, variant: 'steam_gas', location: 'Basement, under the stairs', createdBy: owner });
  home.row.fuel = 'natural_gas';
  home.shape.fuel = 'natural_gas';
  home.shape.steamLwco = 'float';
  addBoiler(f, batch, { appliance: home.row, shape: home.shape, technicianId: techs[0], customerName: 'Agnes Pell' }, clock);

  const kinds: CustomerRow['kind'][] = [...Array(30).fill('homeowner'), 'landlord', 'landlord', 'landlord', 'property_manager', 'property_manager'];
  kinds.forEach((kind, i) => {
    const customer = newCustomer(f, companyId, kind, clock);
    batch.customers.push(customer);
    const siteCount = kind === 'homeowner' ? 1 : f.number.int({ min: 2, max: 3 });
    for (let s = 0; s < siteCount; s++) {
      const technicianId = techs[(i + s) % 2];
      const site = newSite(f, companyId, customer.id, technicianId);
      batch.sites.push(site);
      const common = { companyId, siteId: site.id, today, createdBy: owner };
      const base = { technicianId, customerName: customer.name };
      if (i === 3 && s === 0) {
        const b = planAppliance(f, { ...common, ageYears: 38, variant: 'steam_gas' });
        b.row.status = 'out_of_service';
        addBoiler(f, batch, { ...base, appliance: b.row, shape: b.shape, special: 'unsafe' }, clock);
      } else if (i === 5 && s === 0) {
        const b = planAppliance(f, { ...common, ageYears: 16, variant: 'steam_gas' });
        addBoiler(f, batch, { ...base, appliance: b.row, shape: b.shape, special: 'thermocouple_due' }, clock);
      } else if (i === 8 && s === 0) {
        // A replaced boiler: the old oil-fired steam boiler stays on record, removed, linked to its successor.
        const removedOn = addDays(addYears(today, -3), -40);
        const old = planAppliance(f, { ...common, ageYears: 41, variant: 'steam_oil' });
        const successor = planAppliance(f, { ...common, ageYears: 3, variant: 'hot_water_gas' });
        successor.row.installedOn = removedOn;
        old.row.status = 'removed';
        old.row.replacedById = successor.row.id;
        addBoiler(f, batch, { ...base, appliance: old.row, shape: old.shape, lastDay: removedOn }, clock);
        for (const c of batch.history.components) {
          if (c.applianceId === old.row.id && !c.removedOn) Object.assign(c, { removedOn, removalReason: 'Removed with the appliance' });
        }
        addBoiler(f, batch, { ...base, appliance: successor.row, shape: successor.shape }, clock);
        const occurredAt = clock.at(removedOn, 11);
        const reason = 'Heat exchanger rusted through; replaced with a gas-fired hot-water boiler.';
        batch.history.events.push(
          { companyId, applianceId: old.row.id, occurredAt, kind: 'status', refId: successor.row.id, summary: `Removed; replaced by ${applianceLabel(successor.row)}: ${reason}`, data: { from: 'in_service', to: 'removed', replacedById: successor.row.id, removedOn, reason }, actorId: technicianId },
          { companyId, applianceId: successor.row.id, occurredAt, kind: 'status', refId: old.row.id, summary: `Replaced ${applianceLabel(old.row)}: ${reason}`, data: { replaces: old.row.id, removedOn, reason }, actorId: technicianId },
        );
      } else {
        const b = planAppliance(f, { ...common, ageYears: f.number.int({ min: 2, max: 40 }) });
        addBoiler(f, batch, { ...base, appliance: b.row, shape: b.shape }, clock);
        // Some larger buildings run a second boiler.
        if (kind === 'property_manager' && s === 0) {
          const second = planAppliance(f, { ...common, ageYears: f.number.int({ min: 2, max: 25 }), location: 'Boiler room, east' });
          addBoiler(f, batch, { ...base, appliance: second.row, shape: second.shape }, clock);
        }
      }
    }
  });
}

function seedOtherCompany(f: Faker, batch: Batch, ids: Ids, clock: DemoClock) {
  const companyId = ids.otherCompanyId;
  const today = clock.today;
  const manager = ids.userIds['other-manager@demo.test'];
  for (let i = 0; i < 3; i++) {
    const customer = newCustomer(f, companyId, 'homeowner', clock);
    batch.customers.push(customer);
    const site = { ...newSite(f, companyId, customer.id, manager), town: 'Ashby Hollow' };
    batch.sites.push(site);
    const b = planAppliance(f, { companyId, siteId: site.id, today, ageYears: f.number.int({ min: 6, max: 30 }), createdBy: manager });
    addBoiler(f, batch, { appliance: b.row, shape: b.shape, technicianId: manager, customerName: customer.name }, clock);
  }
}

/**
 * The life-record part of the demo: invented customers in and around Wrenfield, their boilers and years of visits,
 * all of it in the past at `now` on each company's own clocks.
 */
export async function seedDemoRecords(tx: Tx, ids: Ids, now: Date) {
  const f = fakerFor(20261201);
  const batch = new Batch();
  seedDemoCompany(f, batch, ids, demoClock(now, DEMO_COMPANY.timeZone));
  const otherClock = demoClock(now, OTHER_COMPANY.timeZone);
  seedOtherCompany(f, batch, ids, otherClock);
  await batch.write(tx);
  // The demo company's due dates are worked out by seedDemo after its own policies are applied.
  await recomputeDueForCompany(tx, ids.otherCompanyId, { today: otherClock.today });
}
