import { combustionEfficiencyPct, excessAirPctFromO2 } from './combustion-efficiency';
import { airFreeCoLimit, APPLIANCE_KINDS_FOR_CO, combustionSafetyFlags, VENT_TYPES, type CoApplianceKind, type VentType } from './combustion-flags';
import { co2MaxPct, FUEL_MODELS, METHOD_19_SOURCE, requireFuel, type CombustionFuel } from './fuels';
import { SIEGERT_BASIS, siegertFlueLossPct, siegertSource } from './siegert';
import type { TradeFlag } from './trade-flag';
import { requireReading } from './reading-ranges';
import { requireOneOf, TradeInputError } from './trade-input-error';

export { TradeInputError } from './trade-input-error';

/** O2 of air as used by Method 19 and the trade formulas for CO2 and air-free CO. */
const METHOD_19_AIR_O2_PCT = 20.9;

export type CombustionInput = {
  fuel: CombustionFuel;
  /** O2 in dry flue gas, %. */
  o2Pct: number;
  /** CO in flue gas as measured, ppm. */
  coPpm: number;
  flueTempF: number;
  airTempF: number;
  /** Draft, in. w.c.; negative is suction. */
  draftInWc?: number;
  ambientCoPpm?: number;
  /** Seconds the appliance spilled flue gas after start-up. */
  spillageSeconds?: number;
  ventType?: VentType;
  condensing?: boolean;
  /** Chooses the air-free CO limit by appliance standard (200 ppm water heaters, 400 ppm boilers and furnaces). */
  applianceKind?: CoApplianceKind;
  /** Outdoor temperature, °F, for the BPI minimum draft. */
  outdoorTempF?: number;
};

export type CombustionAnalysis = {
  co2Pct: number;
  co2MaxPct: number;
  excessAirPct: number;
  coAirFreePpm: number;
  /** The air-free CO limit of this appliance's standard (200 ppm water heaters, 400 ppm boilers and furnaces). */
  coAirFreeLimitPpm: number;
  /** Combustion efficiency, % of the higher heating value (HHV basis); null for condensing appliances, where this method does not apply. */
  efficiencyPct: number | null;
  efficiencyBasis: string;
  /** Siegert flue-gas loss, % of the lower heating value (LHV basis, net); not 100 − efficiencyPct. */
  siegertLossPct: number;
  siegertBasis: string;
  flags: TradeFlag[];
  sources: { co2: string; coAirFree: string; excessAirAndEfficiency: string; siegert: string };
};

/** CO2 (% dry) from measured O2: CO2max·(20.9 − O2)/20.9. */
export function co2PctFromO2(fuel: CombustionFuel, o2Pct: number): number {
  const o2 = requireReading('o2Pct', o2Pct);
  return (co2MaxPct(fuel) * (METHOD_19_AIR_O2_PCT - o2)) / METHOD_19_AIR_O2_PCT;
}

/** CO corrected to zero O2 (air-free): CO·20.9/(20.9 − O2). */
export function airFreeCoPpm(coPpm: number, o2Pct: number): number {
  const co = requireReading('coPpm', coPpm);
  const o2 = requireReading('o2Pct', o2Pct);
  // Factor first: it is exactly 1 at 0 % O2 and never below 1, so rounding can't put the result under the reading.
  return co * (METHOD_19_AIR_O2_PCT / (METHOD_19_AIR_O2_PCT - o2));
}

export function analyzeCombustion(input: CombustionInput): CombustionAnalysis {
  const fuel = requireFuel('fuel', input.fuel);
  const o2Pct = requireReading('o2Pct', input.o2Pct);
  const coPpm = requireReading('coPpm', input.coPpm);
  const airTempF = requireReading('airTempF', input.airTempF);
  const flueTempF = requireReading('flueTempF', input.flueTempF);
  if (flueTempF < airTempF) {
    throw new TradeInputError('flueTempF', `flue temperature ${flueTempF} °F is below the combustion-air temperature ${airTempF} °F`);
  }
  const optional = <T>(value: T | undefined, check: (v: unknown) => T) => (value === undefined ? undefined : check(value));
  const draftInWc = optional(input.draftInWc, (v) => requireReading('draftInWc', v));
  const ambientCoPpm = optional(input.ambientCoPpm, (v) => requireReading('ambientCoPpm', v));
  const spillageSeconds = optional(input.spillageSeconds, (v) => requireReading('spillageSeconds', v));
  const ventType = optional(input.ventType, (v) => requireOneOf('ventType', v, VENT_TYPES));
  const applianceKind = optional(input.applianceKind, (v) => requireOneOf('applianceKind', v, APPLIANCE_KINDS_FOR_CO));
  const outdoorTempF = optional(input.outdoorTempF, (v) => requireReading('outdoorTempF', v));
  if (input.condensing !== undefined && typeof input.condensing !== 'boolean') {
    throw new TradeInputError('condensing', `must be true or false, got ${String(input.condensing)}`);
  }
  const condensing = input.condensing === true;

  const excessAirPct = excessAirPctFromO2(fuel, o2Pct);
  const coAirFreePpm = airFreeCoPpm(coPpm, o2Pct);
  const flags = combustionSafetyFlags({ coPpm, coAirFreePpm, draftInWc, ambientCoPpm, spillageSeconds, ventType, applianceKind, outdoorTempF });
  if (condensing) {
    flags.push({
      code: 'efficiency_not_applicable',
      severity: 'info',
      message: 'Condensing appliance: flue-loss efficiency does not apply, because part of the latent heat is recovered.',
      value: null,
      threshold: null,
      unit: null,
      source: 'heat-loss method (HHV basis) assumes the flue water leaves as vapour',
    });
  }

  const efficiencyPct = combustionEfficiencyPct({ fuel, excessAirPct, flueMinusAirF: flueTempF - airTempF, airTempF });
  // Physics, not a limit of ours: the flue cannot carry away more heat than the fuel gave. It also holds for condensing
  // appliances, whose sample is judged the same way even though their efficiency is not reported.
  if (efficiencyPct <= 0) {
    throw new TradeInputError(
      'o2Pct',
      `O2 ${o2Pct} % with the flue ${flueTempF} °F and the air ${airTempF} °F means the flue carries away more heat than the fuel gives: ` +
        'the probe is drawing air or the burner is not firing. Check the probe is in the flue and read again.',
    );
  }

  return {
    co2Pct: co2PctFromO2(fuel, o2Pct),
    co2MaxPct: co2MaxPct(fuel),
    excessAirPct,
    coAirFreePpm,
    coAirFreeLimitPpm: airFreeCoLimit(applianceKind).ppm,
    efficiencyPct: condensing ? null : efficiencyPct,
    efficiencyBasis: `HHV basis, heat-loss method, ${FUEL_MODELS[fuel].description}`,
    siegertLossPct: siegertFlueLossPct({ fuel, o2Pct, flueTempF, airTempF }),
    siegertBasis: SIEGERT_BASIS,
    flags,
    sources: {
      co2: `${METHOD_19_SOURCE}; CO2 = CO2max·(20.9 − O2)/20.9`,
      coAirFree: `40 CFR Part 60, Appendix A, Method 19 diluent correction: CO·20.9/(20.9 − O2) (secondary copy); limit: ${airFreeCoLimit(applianceKind).source}`,
      excessAirAndEfficiency:
        'fuel stoichiometry and heat-loss method (HHV basis); checked for natural gas against US DOE Steam Tip Sheet #4 (2006), ' +
        'secondary copy, which it reads 0.3–0.6 points high; propane and No. 2 oil not checked against a published efficiency table',
      siegert: siegertSource(fuel),
    },
  };
}
