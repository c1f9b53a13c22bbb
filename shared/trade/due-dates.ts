import { formatCalendarDate } from '../format/dates';
import { COMPONENT_TYPE_CODES, requireComponentType, type ComponentType } from './component-types';
import { addMonths, dayNumberToIsoDate, isoDateToDayNumber } from './iso-date';
import { SERVICE_LIFE_APPLIANCE_KINDS, type ServiceLifeApplianceKind } from './service-life';
import { requireNumber, requireOneOf, TradeInputError } from './trade-input-error';

export const REPLACEMENT_POLICIES = ['on_condition', 'fixed_age', 'annual'] as const;
export type ReplacementPolicy = (typeof REPLACEMENT_POLICIES)[number];
/** 'learned': the replacement age is the median service life estimated from the company's own part swaps. */
export const DUE_RULE_BASES = ['published', 'common_practice', 'manufacturer', 'company_policy', 'learned'] as const;
export type DueRuleBasis = (typeof DUE_RULE_BASES)[number];

export type DueRule = {
  componentType: ComponentType;
  applianceKind?: ServiceLifeApplianceKind;
  /** Service inspection interval; null when the part is not inspected on a schedule. */
  inspectionIntervalMonths: number | null;
  /** Only for 'fixed_age'; 'annual' means replaced every 12 months, 'on_condition' has no age limit. */
  replacementAgeYears: number | null;
  replacementPolicy: ReplacementPolicy;
  basis: DueRuleBasis;
  source: string;
  /** Routine test by the owner or operator between visits; shown on checklists, not used for due dates. */
  ownerTest?: { intervalDays: number; task: string; source: string };
};

export type DueStatus = 'ok' | 'due_soon' | 'overdue' | 'replace_now';

export type ComponentDue = {
  nextDue: { kind: 'inspection' | 'replacement'; dueOn: string } | null;
  replacementDueOn: string | null;
  inspectionDueOn: string | null;
  status: DueStatus;
  reason: string;
};

export type ComponentDueInput = {
  rule: DueRule;
  /** When this part was fitted; null when it is original with the appliance (or unknown). */
  installedOn: string | null;
  applianceInstalledOn: string | null;
  lastInspectedOn: string | null;
  /** The latest inspection found the part failed or unfit: it is replaced now, whatever its age. */
  conditionFailed: boolean;
  today: string;
  /** "Due soon" covers due dates from today through this many days ahead. */
  horizonDays: number;
};

/** When a component next needs inspecting or replacing, and how urgent that is on `today`. */
export function computeComponentDue(input: ComponentDueInput): ComponentDue {
  const rule = validateRule(input.rule);
  const today = isoDateToDayNumber('today', input.today);
  const horizonDays = requireNumber('horizonDays', input.horizonDays, { min: 0 });
  const dateOrNull = (field: string, value: string | null) => {
    if (value === null) return null;
    const day = isoDateToDayNumber(field, value);
    if (day > today) throw new TradeInputError(field, `${value} is after today ${input.today}`);
    return value;
  };
  const ownInstall = dateOrNull('installedOn', input.installedOn);
  const applianceInstall = dateOrNull('applianceInstalledOn', input.applianceInstalledOn);
  const lastInspected = dateOrNull('lastInspectedOn', input.lastInspectedOn);
  if (typeof input.conditionFailed !== 'boolean') throw new TradeInputError('conditionFailed', 'must be true or false');

  // A part with no install date of its own is taken to be original with the appliance.
  const installed = ownInstall ?? applianceInstall;
  // Dates in reasons are written for people ("Jan 6, 2026"), never as ISO strings.
  const day = (iso: string) => formatCalendarDate(iso);
  const installedFrom = ownInstall ? `installed ${day(ownInstall)}` : applianceInstall ? `original with the appliance, installed ${day(applianceInstall)}` : null;

  let replacementDueOn: string | null = null;
  let replacementWhy = '';
  if (rule.replacementPolicy !== 'on_condition' && installed) {
    const months = rule.replacementPolicy === 'annual' ? 12 : Math.round(rule.replacementAgeYears! * 12);
    replacementDueOn = addMonths(installed, months);
    replacementWhy =
      rule.replacementPolicy === 'annual'
        ? `replaced at every annual service (${installedFrom})`
        : `replacement age ${rule.replacementAgeYears} years (${installedFrom})`;
  }

  let inspectionDueOn: string | null = null;
  let inspectionWhy = '';
  if (rule.inspectionIntervalMonths !== null) {
    // The clock restarts at the later of the last inspection and the fitting of the present part.
    const base = [lastInspected, installed].filter((d): d is string => d !== null).sort().at(-1) ?? null;
    inspectionDueOn = base ? addMonths(base, rule.inspectionIntervalMonths) : dayNumberToIsoDate(today);
    inspectionWhy = base
      ? `every ${rule.inspectionIntervalMonths} months since ${base === lastInspected ? `last inspection ${day(base)}` : installedFrom}`
      : 'no inspection or install date on record';
  }

  if (input.conditionFailed) {
    const dueOn = dayNumberToIsoDate(today);
    return {
      nextDue: { kind: 'replacement', dueOn },
      replacementDueOn: dueOn,
      inspectionDueOn,
      status: 'replace_now',
      reason: 'Failed on condition at inspection: replace now. Findings override age.',
    };
  }

  const candidates = [
    replacementDueOn && { kind: 'replacement' as const, dueOn: replacementDueOn, why: replacementWhy },
    inspectionDueOn && { kind: 'inspection' as const, dueOn: inspectionDueOn, why: inspectionWhy },
  ].filter((c) => !!c);
  // Earliest first; on a tie the replacement wins, since fitting a new part includes looking at it.
  candidates.sort((a, b) => a.dueOn.localeCompare(b.dueOn) || (a.kind === 'replacement' ? -1 : 1));
  const next = candidates[0];

  if (!next) {
    const unknownAge = rule.replacementPolicy !== 'on_condition' && !installed;
    return {
      nextDue: null,
      replacementDueOn,
      inspectionDueOn,
      status: 'ok',
      reason: unknownAge
        ? 'Install date unknown, so the age-based replacement date cannot be worked out. Record the install date.'
        : 'Replaced on condition; no scheduled inspection.',
    };
  }

  const daysLeft = isoDateToDayNumber('dueOn', next.dueOn) - today;
  const status: DueStatus = daysLeft < 0 ? 'overdue' : daysLeft <= horizonDays ? 'due_soon' : 'ok';
  const when =
    daysLeft < 0
      ? `was due ${day(next.dueOn)} (${-daysLeft} days ago)`
      : daysLeft === 0
        ? `is due today (${day(next.dueOn)})`
        : `is due ${day(next.dueOn)}, in ${daysLeft} days`;
  const what = next.kind === 'replacement' ? 'Replacement' : 'Inspection';
  return {
    nextDue: { kind: next.kind, dueOn: next.dueOn },
    replacementDueOn,
    inspectionDueOn,
    status,
    reason: `${what} ${when}: ${next.why}.`,
  };
}

function validateRule(rule: DueRule): DueRule {
  if (!rule || typeof rule !== 'object') throw new TradeInputError('rule', 'is missing');
  requireComponentType('rule.componentType', rule.componentType);
  if (rule.applianceKind !== undefined) requireOneOf('rule.applianceKind', rule.applianceKind, SERVICE_LIFE_APPLIANCE_KINDS);
  const policy = requireOneOf('rule.replacementPolicy', rule.replacementPolicy, REPLACEMENT_POLICIES);
  requireOneOf('rule.basis', rule.basis, DUE_RULE_BASES);
  if (typeof rule.source !== 'string' || rule.source.trim() === '') throw new TradeInputError('rule.source', 'every rule names its source');
  if (rule.inspectionIntervalMonths !== null) {
    const months = requireNumber('rule.inspectionIntervalMonths', rule.inspectionIntervalMonths, { min: 1 });
    if (!Number.isInteger(months)) throw new TradeInputError('rule.inspectionIntervalMonths', 'must be a whole number of months');
  }
  if (policy === 'fixed_age') {
    const years = requireNumber('rule.replacementAgeYears', rule.replacementAgeYears, { minExclusive: 0 });
    if (!Number.isInteger(years * 12)) throw new TradeInputError('rule.replacementAgeYears', 'must be a whole number of months');
  } else if (rule.replacementAgeYears !== null) {
    throw new TradeInputError('rule.replacementAgeYears', `must be empty for the ${policy} policy`);
  }
  return rule;
}

// ---- Default catalog ---------------------------------------------------------------------------------------------

const ON_CONDITION = 'common practice: inspected at every annual service visit; replaced on condition';
const ASHRAE = 'ASHRAE Handbook, HVAC Applications, "Owning and Operating Costs" chapter, service-life table (1978 survey), secondary copy';
const SECTION_VI = 'ASME BPVC Section VI, Recommended Rules for the Care and Operation of Heating Boilers';

/**
 * ASHRAE median service lives kept as planning ages: the stock forecast lists parts past them to plan for, and the
 * due engine never turns them into replacement dates.
 */
export const PLANNING_MEDIAN_YEARS = {
  circulator: { years: 10, row: 'pumps, pipe-mounted' },
  burners: { years: 21, row: 'burners' },
} as const satisfies Partial<Record<ComponentType, { years: number; row: string }>>;
export const PLANNING_MEDIAN_SOURCE = `${ASHRAE}: medians describe populations, not one unit: a reason to inspect and plan, not a fault`;

const onCondition = (componentType: ComponentType): DueRule => ({
  componentType,
  inspectionIntervalMonths: 12,
  replacementAgeYears: null,
  replacementPolicy: 'on_condition',
  basis: 'common_practice',
  source: ON_CONDITION,
});

const replacedEveryService = (componentType: ComponentType): DueRule => ({
  componentType,
  inspectionIntervalMonths: 12,
  replacementAgeYears: null,
  replacementPolicy: 'annual',
  basis: 'common_practice',
  source: 'common practice: replaced at every annual service',
});

/**
 * Age is not a fault: ASHRAE's medians describe populations, not one unit, so a part past its median is inspected and
 * planned for (the replacement prospects, the stock forecast), never "replacement due" by age alone. Replacement is
 * due on condition, or where a company sets a replacement interval of its own or from the manufacturer.
 */
const medianAge = (componentType: ComponentType, years: number, row: string): DueRule => ({
  componentType,
  inspectionIntervalMonths: 12,
  replacementAgeYears: null,
  replacementPolicy: 'on_condition',
  basis: 'common_practice',
  source:
    `${ON_CONDITION}. ${ASHRAE}: "${row}" median ${years} years is a planning age for the whole population, ` +
    'not a replacement date for one unit',
});

/**
 * Steam safety valves and hot-water relief valves are tested on different intervals; neither interval has been read
 * in a publication here, so both rules are common practice, each naming the publication it is recalled from.
 */
const valveTest = (componentType: ComponentType, ownerIntervalDays: number, recalled: string): DueRule => ({
  componentType,
  inspectionIntervalMonths: 12,
  replacementAgeYears: null,
  replacementPolicy: 'on_condition',
  basis: 'common_practice',
  source: `common practice: pressure (set-point) test at the annual service, replaced on condition; testing is covered by ${SECTION_VI}`,
  ownerTest: { intervalDays: ownerIntervalDays, task: 'try-lever (manual) test', source: `from memory: ${SECTION_VI}: ${recalled}` },
});

const defaults: Record<ComponentType, DueRule> = {
  ...(Object.fromEntries(COMPONENT_TYPE_CODES.map((t) => [t, onCondition(t)])) as Record<ComponentType, DueRule>),
  burners: medianAge('burners', PLANNING_MEDIAN_YEARS.burners.years, PLANNING_MEDIAN_YEARS.burners.row),
  circulator: medianAge('circulator', PLANNING_MEDIAN_YEARS.circulator.years, PLANNING_MEDIAN_YEARS.circulator.row),
  nozzle: replacedEveryService('nozzle'),
  oil_filter: replacedEveryService('oil_filter'),
  low_water_cutoff_float: {
    ...onCondition('low_water_cutoff_float'),
    source: `${ON_CONDITION}; the owner's blowdown test follows ${SECTION_VI}`,
    ownerTest: {
      intervalDays: 7,
      task: 'blow down the float chamber with the burner firing and confirm the burner stops',
      source: `from memory: ${SECTION_VI}: weekly during the heating season`,
    },
  },
  low_water_cutoff_probe: {
    ...onCondition('low_water_cutoff_probe'),
    source: `${ON_CONDITION}; testing is covered by ${SECTION_VI}, method and interval per the control manufacturer's instructions`,
  },
  // Low-pressure steam: the try-lever test monthly in the heating season; hot water: quarterly.
  safety_valve: valveTest('safety_valve', 30, 'steam safety valve, try-lever test monthly during the heating season'),
  relief_valve: valveTest('relief_valve', 91, 'hot-water relief valve, try-lever test quarterly'),
};

/** Default due rules, one per component type. Companies override these with their own policy. */
export const DEFAULT_DUE_RULES: Readonly<Record<ComponentType, DueRule>> = defaults;
