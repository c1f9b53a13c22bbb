import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { COMPONENT_TYPE_CODES } from '../../../shared/trade/component-types';
import { computeComponentDue, DEFAULT_DUE_RULES, type ComponentDueInput, type DueRule } from '../../../shared/trade/due-dates';
import { addDays, daysBetween } from '../../../shared/trade/iso-date';
import { TradeInputError } from '../../../shared/trade/trade-input-error';

const inspectYearly: DueRule = DEFAULT_DUE_RULES.gauge_glass; // common practice: inspected every annual visit
const base: ComponentDueInput = {
  rule: inspectYearly,
  installedOn: null,
  applianceInstalledOn: '2010-09-01',
  lastInspectedOn: '2024-03-15',
  conditionFailed: false,
  today: '2025-03-15',
  horizonDays: 30,
};
const due = (input: Partial<ComponentDueInput>) => computeComponentDue({ ...base, ...input });
const companyTenYears: DueRule = {
  componentType: 'circulator',
  inspectionIntervalMonths: 12,
  replacementAgeYears: 10,
  replacementPolicy: 'fixed_age',
  basis: 'company_policy',
  source: 'company policy: circulators replaced at 10 years',
};

describe('computeComponentDue', () => {
  it('due today', () => {
    const result = due({});
    expect(result).toMatchObject({
      nextDue: { kind: 'inspection', dueOn: '2025-03-15' },
      inspectionDueOn: '2025-03-15',
      replacementDueOn: null,
      status: 'due_soon',
    });
    expect(result.reason).toMatch(/due today/);
  });

  it('due in N days: due soon inside the horizon, ok beyond it', () => {
    const soon = due({ lastInspectedOn: '2024-04-01' });
    expect(soon).toMatchObject({ nextDue: { kind: 'inspection', dueOn: '2025-04-01' }, status: 'due_soon' });
    expect(soon.reason).toMatch(/in 17 days/);
    expect(due({ lastInspectedOn: '2024-04-01', horizonDays: 16 }).status).toBe('ok');
    expect(due({ lastInspectedOn: '2024-04-01', horizonDays: 17 }).status).toBe('due_soon');
  });

  it('overdue', () => {
    const result = due({ lastInspectedOn: '2023-12-01' });
    expect(result).toMatchObject({ nextDue: { dueOn: '2024-12-01' }, status: 'overdue' });
    expect(result.reason).toBe('Inspection was due Dec 1, 2024 (104 days ago): every 12 months since last inspection Dec 1, 2023.');
  });

  it('a failed condition means replace now, whatever the age', () => {
    const result = due({ lastInspectedOn: '2025-03-01', conditionFailed: true });
    expect(result).toMatchObject({ nextDue: { kind: 'replacement', dueOn: '2025-03-15' }, replacementDueOn: '2025-03-15', status: 'replace_now' });
    expect(result.reason).toMatch(/Findings override age/);
  });

  it('a part original with the appliance ages from the appliance install date', () => {
    // A company's own fixed replacement interval (company policy, 10 years): the arithmetic of a fixed-age rule.
    const result = due({
      rule: companyTenYears,
      applianceInstalledOn: '2015-06-01',
      lastInspectedOn: '2024-10-01',
      today: '2025-05-01',
      horizonDays: 60,
    });
    expect(result).toMatchObject({
      replacementDueOn: '2025-06-01',
      inspectionDueOn: '2025-10-01',
      nextDue: { kind: 'replacement', dueOn: '2025-06-01' },
      status: 'due_soon',
    });
    expect(result.reason).toMatch(/original with the appliance/);
    // Dates are said in words (formatCalendarDate, en-US), never as ISO strings.
    expect(result.reason).toBe('Replacement is due Jun 1, 2025, in 31 days: replacement age 10 years (original with the appliance, installed Jun 1, 2015).');
    // a circulator fitted later ages from its own date
    expect(due({ rule: companyTenYears, installedOn: '2020-01-01', today: '2025-05-01' }).replacementDueOn).toBe('2030-01-01');
  });

  it('a company-policy age gives a replacement due date', () => {
    const fiveYearThermocouple: DueRule = {
      componentType: 'thermocouple',
      inspectionIntervalMonths: 12,
      replacementAgeYears: 5,
      replacementPolicy: 'fixed_age',
      basis: 'company_policy',
      source: 'company policy: thermocouples replaced at 5 years',
    };
    const result = due({ rule: fiveYearThermocouple, installedOn: '2020-02-29', lastInspectedOn: '2024-11-01', today: '2025-03-10' });
    expect(result.replacementDueOn).toBe('2025-02-28'); // leap day clamps to the end of February
    expect(result).toMatchObject({ nextDue: { kind: 'replacement', dueOn: '2025-02-28' }, status: 'overdue' });
    expect(result.reason).toMatch(/replacement age 5 years/);
  });

  it('annual parts are due a year after fitting; on a tie the replacement wins', () => {
    // common practice: oil nozzle replaced at every annual service
    const result = due({ rule: DEFAULT_DUE_RULES.nozzle, installedOn: '2024-10-15', lastInspectedOn: '2024-10-15', today: '2025-10-01' });
    expect(result).toMatchObject({ replacementDueOn: '2025-10-15', inspectionDueOn: '2025-10-15', nextDue: { kind: 'replacement' }, status: 'due_soon' });
  });

  it('a newer part restarts the inspection clock', () => {
    expect(due({ installedOn: '2024-09-01', lastInspectedOn: '2024-03-15' }).inspectionDueOn).toBe('2025-09-01');
  });

  it('with no dates at all, inspection is due today', () => {
    const result = due({ applianceInstalledOn: null, lastInspectedOn: null });
    expect(result).toMatchObject({ inspectionDueOn: '2025-03-15', status: 'due_soon' });
    expect(result.reason).toMatch(/no inspection or install date/);
  });

  it('an on-condition part with no inspection interval is never due by date', () => {
    const rule: DueRule = { ...inspectYearly, inspectionIntervalMonths: null };
    expect(due({ rule })).toMatchObject({ nextDue: null, status: 'ok' });
  });

  it('a fixed-age part with no install date says the date is missing', () => {
    const result = due({ rule: DEFAULT_DUE_RULES.burners, applianceInstalledOn: null, lastInspectedOn: null });
    expect(result.replacementDueOn).toBeNull();
    expect(result.nextDue).toMatchObject({ kind: 'inspection' });
  });

  it.each([
    [{ rule: { ...inspectYearly, replacementPolicy: 'fixed_age' } }, 'rule.replacementAgeYears'],
    [{ rule: { ...inspectYearly, replacementAgeYears: 7 } }, 'rule.replacementAgeYears'],
    [{ rule: { ...inspectYearly, inspectionIntervalMonths: 1.5 } }, 'rule.inspectionIntervalMonths'],
    [{ rule: { ...inspectYearly, source: ' ' } }, 'rule.source'],
    [{ rule: { ...inspectYearly, componentType: 'widget' } }, 'rule.componentType'],
    [{ lastInspectedOn: '2025-04-01' }, 'lastInspectedOn'],
    [{ installedOn: '2025-13-01' }, 'installedOn'],
    [{ today: '15/03/2025' }, 'today'],
    [{ horizonDays: -1 }, 'horizonDays'],
  ])('rejects %j on %s', (bad, field) => {
    try {
      due(bad as Partial<ComponentDueInput>);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(TradeInputError);
      expect((error as TradeInputError).field).toBe(field);
    }
  });

  it('status always agrees with the days left', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...COMPONENT_TYPE_CODES),
        fc.integer({ min: 0, max: 9000 }),
        fc.integer({ min: 0, max: 9000 }),
        fc.integer({ min: 0, max: 120 }),
        (type, installedAgo, inspectedAgo, horizonDays) => {
          const today = '2025-06-15';
          const result = computeComponentDue({
            rule: DEFAULT_DUE_RULES[type],
            installedOn: addDays(today, -installedAgo),
            applianceInstalledOn: null,
            lastInspectedOn: addDays(today, -inspectedAgo),
            conditionFailed: false,
            today,
            horizonDays,
          });
          if (!result.nextDue) return result.status === 'ok';
          const left = daysBetween(today, result.nextDue.dueOn);
          const expected = left < 0 ? 'overdue' : left <= horizonDays ? 'due_soon' : 'ok';
          return result.status === expected;
        },
      ),
    );
  });
});

describe('DEFAULT_DUE_RULES', () => {
  it('has a rule for every component type', () => {
    for (const type of COMPONENT_TYPE_CODES) expect(DEFAULT_DUE_RULES[type].componentType).toBe(type);
  });

  it('names the ASHRAE medians for circulators and burners as planning ages, never as replacement dates', () => {
    // Source: ASHRAE Handbook, HVAC Applications, "Owning and Operating Costs", service-life table (secondary copy):
    // pumps, pipe-mounted 10; burners 21. The medians describe populations, not one unit.
    expect(DEFAULT_DUE_RULES.circulator).toMatchObject({ replacementPolicy: 'on_condition', replacementAgeYears: null, inspectionIntervalMonths: 12 });
    expect(DEFAULT_DUE_RULES.circulator.source).toMatch(/ASHRAE.*pumps, pipe-mounted" median 10 years is a planning age/);
    expect(DEFAULT_DUE_RULES.burners).toMatchObject({ replacementPolicy: 'on_condition', replacementAgeYears: null });
    expect(DEFAULT_DUE_RULES.burners.source).toMatch(/"burners" median 21 years/);
  });

  it('a working 11-year-old circulator is not overdue: it is inspected at the annual visit', () => {
    // Source: ASHRAE service-life table (secondary copy): pumps, pipe-mounted median 10 years, a planning age only.
    const result = due({ rule: DEFAULT_DUE_RULES.circulator, applianceInstalledOn: '2014-01-10', lastInspectedOn: '2024-11-20', today: '2025-02-01', horizonDays: 30 });
    expect(result).toMatchObject({ status: 'ok', replacementDueOn: null, nextDue: { kind: 'inspection', dueOn: '2025-11-20' } });
    expect(result.reason).not.toMatch(/replace/i);
    // Condition still decides: a failed circulator is replaced now, whatever its age.
    expect(due({ rule: DEFAULT_DUE_RULES.circulator, conditionFailed: true, today: '2025-02-01' }).status).toBe('replace_now');
  });

  it('no default rule makes a part due for replacement by its age', () => {
    fc.assert(
      fc.property(fc.constantFrom(...COMPONENT_TYPE_CODES), fc.integer({ min: 0, max: 60 }), (type, ageYears) => {
        const rule = DEFAULT_DUE_RULES[type];
        if (rule.replacementPolicy === 'annual') return true; // replaced at every service by practice, not by wear
        const r = computeComponentDue({ ...base, rule, applianceInstalledOn: `${2025 - ageYears}-01-01`, lastInspectedOn: '2025-01-02', today: '2025-03-15' });
        return r.replacementDueOn === null && r.nextDue?.kind !== 'replacement';
      }),
    );
  });

  it('replaces the oil nozzle and filter at every annual service', () => {
    // common practice
    for (const type of ['nozzle', 'oil_filter'] as const) {
      expect(DEFAULT_DUE_RULES[type]).toMatchObject({ replacementPolicy: 'annual', basis: 'common_practice' });
    }
  });

  it('refers low-water cutoff and safety/relief valve testing to ASME Section VI, with intervals marked from memory', () => {
    for (const type of ['low_water_cutoff_float', 'safety_valve', 'relief_valve'] as const) {
      const rule = DEFAULT_DUE_RULES[type];
      expect(rule.ownerTest?.source).toMatch(/^from memory: ASME BPVC Section VI, Recommended Rules for the Care and Operation of Heating Boilers/);
    }
    expect(DEFAULT_DUE_RULES.low_water_cutoff_probe.source).toMatch(/ASME BPVC Section VI/);
  });

  it('gives steam safety valves and hot-water relief valves their own try-lever intervals, marked common practice', () => {
    // from memory: ASME BPVC Section VI: steam safety valves monthly in the heating season, hot-water relief valves quarterly
    expect(DEFAULT_DUE_RULES.safety_valve.ownerTest?.intervalDays).toBe(30);
    expect(DEFAULT_DUE_RULES.relief_valve.ownerTest?.intervalDays).toBe(91);
    for (const type of ['safety_valve', 'relief_valve'] as const) {
      expect(DEFAULT_DUE_RULES[type]).toMatchObject({ basis: 'common_practice' });
      expect(DEFAULT_DUE_RULES[type].source).toMatch(/^common practice/);
    }
    expect(DEFAULT_DUE_RULES.safety_valve.ownerTest?.source).toMatch(/steam safety valve/);
    expect(DEFAULT_DUE_RULES.relief_valve.ownerTest?.source).toMatch(/hot-water relief valve/);
  });

  it('never gives an age limit on the strength of common practice', () => {
    for (const type of COMPONENT_TYPE_CODES) {
      const rule = DEFAULT_DUE_RULES[type];
      if (rule.replacementAgeYears !== null) expect(rule.basis).toBe('published');
      if (rule.basis === 'common_practice') expect(rule.replacementAgeYears).toBeNull();
    }
    const aged = COMPONENT_TYPE_CODES.filter((t) => DEFAULT_DUE_RULES[t].replacementAgeYears !== null);
    expect(aged).toEqual([]);
  });
});
