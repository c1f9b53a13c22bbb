import type { TradeFlag } from './trade-flag';
import { requireReading } from './reading-ranges';
import { requireNumber, requireOneOf } from './trade-input-error';
import { inWcToPascal } from './units';
import { BPI_DRAFT_TABLE, BPI_DRAFT_TABLE_SOURCE, bpiMinimumDraftPa } from './draft-minimum-by-outdoor-temp';

export const VENT_TYPES = ['draft_hood', 'barometric_damper', 'power_vent', 'direct_vent'] as const;
export type VentType = (typeof VENT_TYPES)[number];

const BPI_BANDS = 'from memory: BPI-1200 flue-CO action levels (as-measured CO)';
const BPI_STANDARDS = 'BPI Technical Standards for the Building Analyst (secondary)';

/** Air-free CO limit for certifying vented heating appliances. A certification limit, not a field action level. */
export const AIR_FREE_CO_CERTIFICATION_LIMIT_PPM = 400;
/** Air-free CO limit for certifying conventional residential storage water heaters. */
export const WATER_HEATER_AIR_FREE_CO_LIMIT_PPM = 200;

export const APPLIANCE_KINDS_FOR_CO = ['steam_boiler', 'hot_water_boiler', 'water_heater', 'furnace'] as const;
export type CoApplianceKind = (typeof APPLIANCE_KINDS_FOR_CO)[number];

export type AirFreeCoLimit = { ppm: number; standard: string; source: string };

/**
 * One air-free CO limit per appliance standard: 200 ppm for water heaters, 400 ppm for vented heating equipment
 * (boilers, furnaces). Without a kind, the heating-equipment limit applies. The ANSI Z21 standards are gas-appliance
 * standards; an oil appliance's sample is held to the same limit by common practice.
 */
export function airFreeCoLimit(kind?: CoApplianceKind): AirFreeCoLimit {
  if (kind !== undefined) requireOneOf('applianceKind', kind, APPLIANCE_KINDS_FOR_CO);
  if (kind === 'water_heater') {
    return {
      ppm: WATER_HEATER_AIR_FREE_CO_LIMIT_PPM,
      standard: 'ANSI Z21.10.1 (gas water heaters)',
      source: 'ANSI Z21 appliance standards: 200 ppm air-free CO for conventional residential water heaters (ANSI Z21.10.1), quoted in trade literature (secondary)',
    };
  }
  if (kind === 'furnace') {
    return {
      ppm: AIR_FREE_CO_CERTIFICATION_LIMIT_PPM,
      standard: 'ANSI Z21.47 (gas furnaces)',
      source: 'ANSI Z21 appliance standards: 400 ppm air-free CO for vented heating equipment, quoted in trade literature (secondary; the furnace standard number Z21.47 is from memory)',
    };
  }
  return {
    ppm: AIR_FREE_CO_CERTIFICATION_LIMIT_PPM,
    standard: 'ANSI Z21.13 (gas boilers)',
    source: 'ANSI Z21 vented-appliance standards, 400 ppm air-free CO (secondary; that Z21.13 boilers use 400 ppm is from memory)',
  };
}
/** Upper ends of the BPI flue-CO bands, as-measured ppm: acceptable, service recommended, service required. */
export const BPI_FLUE_CO_BANDS_PPM = { acceptable: 25, serviceRecommended: 100, serviceRequired: 400 } as const;
/** BPI draft test without an outdoor temperature: the table's cold-weather minimum (see draft-minimum-by-outdoor-temp.ts). */
export const BPI_MIN_DRAFT_PA = BPI_DRAFT_TABLE.coldMinimumPa;
export const BPI_SPILLAGE_LIMIT_SECONDS = 60;
/**
 * from memory: BPI Technical Standards for the Building Analyst Professional (and BPI-1200): the spillage test is made
 * at the draft diverter or at the barometric draft control, and spillage past 60 s after start-up fails either way.
 */
const BPI_SPILLAGE_SOURCE = `${BPI_STANDARDS}; that barometric-damper appliances are held to the same 60 s is from memory`;
export const BPI_AMBIENT_CO_ABORT_PPM = 35;
/** Above this ambient CO (and up to the abort level) the occupant is advised. 9 ppm is also the NAAQS 8-hour level. */
export const BPI_AMBIENT_CO_ADVISE_PPM = 9;
const BPI_AMBIENT_ADVISE =
  'from memory: BPI Technical Standards for the Building Analyst, ambient CO action levels (advise the occupant above 9 ppm); ' +
  'US NAAQS: 9 ppm over 8 hours (secondary)';

export type CombustionFlagInput = {
  coPpm: number;
  coAirFreePpm: number;
  draftInWc?: number;
  ambientCoPpm?: number;
  spillageSeconds?: number;
  ventType?: VentType;
  /** Chooses the air-free CO limit by appliance standard; without it the heating-equipment limit applies. */
  applianceKind?: CoApplianceKind;
  /** Outdoor temperature, °F: the BPI minimum draft depends on it. */
  outdoorTempF?: number;
};

const NATURAL_DRAFT: readonly VentType[] = ['draft_hood', 'barometric_damper'];

export function combustionSafetyFlags(input: CombustionFlagInput): TradeFlag[] {
  const flags: TradeFlag[] = [];
  const coPpm = requireReading('coPpm', input.coPpm);
  const coAirFreePpm = requireNumber('coAirFreePpm', input.coAirFreePpm, { min: coPpm });
  const optional = <T>(value: T | undefined, check: (v: unknown) => T) => (value === undefined ? undefined : check(value));
  const draftInWc = optional(input.draftInWc, (v) => requireReading('draftInWc', v));
  const ambientCoPpm = optional(input.ambientCoPpm, (v) => requireReading('ambientCoPpm', v));
  const spillageSeconds = optional(input.spillageSeconds, (v) => requireReading('spillageSeconds', v));
  const ventType = optional(input.ventType, (v) => requireOneOf('ventType', v, VENT_TYPES));
  const coLimit = airFreeCoLimit(optional(input.applianceKind, (v) => requireOneOf('applianceKind', v, APPLIANCE_KINDS_FOR_CO)));
  const outdoorTempF = optional(input.outdoorTempF, (v) => requireReading('outdoorTempF', v));

  if (ambientCoPpm !== undefined && ambientCoPpm > BPI_AMBIENT_CO_ABORT_PPM) {
    flags.push({
      code: 'ambient_co_stop_work',
      severity: 'stop',
      message: `Ambient CO ${ambientCoPpm} ppm is above ${BPI_AMBIENT_CO_ABORT_PPM} ppm: stop the work and get people to fresh air.`,
      value: ambientCoPpm,
      threshold: BPI_AMBIENT_CO_ABORT_PPM,
      unit: 'ppm',
      source: BPI_STANDARDS,
    });
  } else if (ambientCoPpm !== undefined && ambientCoPpm > BPI_AMBIENT_CO_ADVISE_PPM) {
    flags.push({
      code: 'ambient_co_advise_occupant',
      severity: 'warning',
      message:
        `Ambient CO ${ambientCoPpm} ppm is above ${BPI_AMBIENT_CO_ADVISE_PPM} ppm: tell the occupant, look for the source ` +
        '(this appliance, another appliance, a vehicle) and recommend a working CO alarm. Above ' +
        `${BPI_AMBIENT_CO_ABORT_PPM} ppm, stop the work and get people to fresh air.`,
      value: ambientCoPpm,
      threshold: BPI_AMBIENT_CO_ADVISE_PPM,
      unit: 'ppm',
      source: BPI_AMBIENT_ADVISE,
    });
  }

  const spillageFailed =
    ventType !== undefined && NATURAL_DRAFT.includes(ventType) && spillageSeconds !== undefined && spillageSeconds > BPI_SPILLAGE_LIMIT_SECONDS;
  if (spillageFailed) {
    flags.push({
      code: 'spillage_over_limit',
      severity: 'stop',
      message:
        `${ventType === 'draft_hood' ? 'Draft-hood' : 'Barometric-damper'} appliance spilled for ${spillageSeconds} s, more than ` +
        `${BPI_SPILLAGE_LIMIT_SECONDS} s after start-up: flue gas is entering the building.`,
      value: spillageSeconds,
      threshold: BPI_SPILLAGE_LIMIT_SECONDS,
      unit: 's',
      source: ventType === 'draft_hood' ? BPI_STANDARDS : BPI_SPILLAGE_SOURCE,
    });
  }

  flags.push(...flueCoFlags(coPpm, spillageFailed));

  if (coAirFreePpm > coLimit.ppm) {
    flags.push({
      code: 'air_free_co_above_certification_limit',
      severity: 'warning',
      message:
        `Air-free CO ${Math.round(coAirFreePpm)} ppm is above the ${coLimit.ppm} ppm limit of ${coLimit.standard} used to certify ` +
        'this kind of appliance. This is a certification limit, not a field action level.',
      value: coAirFreePpm,
      threshold: coLimit.ppm,
      unit: 'ppm air-free',
      source: coLimit.source,
    });
  }

  if (draftInWc !== undefined) flags.push(...draftFlags(draftInWc, ventType, outdoorTempF));

  if (ventType === undefined && (draftInWc !== undefined || spillageSeconds !== undefined)) {
    flags.push({
      code: 'vent_type_not_given',
      severity: 'info',
      message: 'Vent type not given, so draft and spillage were not judged.',
      value: null,
      threshold: null,
      unit: null,
      source: BPI_STANDARDS,
    });
  }
  return flags;
}

/** BPI bands are applied to CO as measured, not air-free. */
function flueCoFlags(coPpm: number, spillageFailed: boolean): TradeFlag[] {
  const bands = BPI_FLUE_CO_BANDS_PPM;
  const flag = (code: string, severity: TradeFlag['severity'], message: string, threshold: number): TradeFlag[] => [
    { code, severity, message, value: coPpm, threshold, unit: 'ppm as measured', source: BPI_BANDS },
  ];
  if (coPpm > bands.serviceRequired) {
    return flag('flue_co_stop', 'stop', `Flue CO ${coPpm} ppm is over ${bands.serviceRequired} ppm: stop.`, bands.serviceRequired);
  }
  if (coPpm > bands.serviceRecommended && spillageFailed) {
    return flag(
      'flue_co_stop',
      'stop',
      `Flue CO ${coPpm} ppm is over ${bands.serviceRecommended} ppm with spillage: stop.`,
      bands.serviceRecommended,
    );
  }
  if (coPpm > bands.serviceRecommended) {
    return flag('flue_co_service_required', 'warning', `Flue CO ${coPpm} ppm: service required.`, bands.serviceRecommended);
  }
  if (coPpm > bands.acceptable) {
    return flag('flue_co_service_recommended', 'info', `Flue CO ${coPpm} ppm: service recommended.`, bands.acceptable);
  }
  return [];
}

/** Power and direct vents are judged by the manufacturer's instructions, so only natural-draft vents get a flag. */
function draftFlags(draftInWc: number, ventType: VentType | undefined, outdoorTempF: number | undefined): TradeFlag[] {
  if (ventType === undefined || !NATURAL_DRAFT.includes(ventType)) return [];
  const draftPa = inWcToPascal(draftInWc);
  if (draftPa > 0) {
    return [
      {
        code: 'draft_positive',
        severity: 'stop',
        message: `Positive pressure (${draftInWc} in. w.c.) in a natural-draft vent: flue gas can enter the building.`,
        value: draftPa,
        threshold: 0,
        unit: 'Pa',
        source: 'common practice',
      },
    ];
  }
  const minimumPa = outdoorTempF === undefined ? BPI_MIN_DRAFT_PA : bpiMinimumDraftPa(outdoorTempF);
  if (draftPa > minimumPa) {
    const basis =
      outdoorTempF === undefined
        ? 'No outdoor temperature was recorded, so the cold-weather minimum is applied.'
        : `That is the BPI minimum at ${outdoorTempF} °F outdoors.`;
    return [
      {
        code: 'draft_below_minimum',
        severity: 'warning',
        message:
          `Draft ${draftPa.toFixed(1)} Pa (${draftInWc} in. w.c.) is weaker than ${minimumPa.toFixed(2)} Pa, measured at steady ` +
          `state (5–10 minutes of firing). ${basis}`,
        value: draftPa,
        threshold: minimumPa,
        unit: 'Pa',
        source: BPI_DRAFT_TABLE_SOURCE,
      },
    ];
  }
  return [];
}
