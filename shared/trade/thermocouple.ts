import type { TradeFlag } from './trade-flag';
import { requireReading } from './reading-ranges';

export const THERMOCOUPLE_TYPICAL_OPEN_CIRCUIT_MV = { min: 25, max: 30 } as const;
export const THERMOCOUPLE_REPLACE_BELOW_OPEN_CIRCUIT_MV = 18;

const TYPICAL_SOURCE = 'Basic HVAC, BCcampus open textbook, chapter 19 (read): open circuit "usually around 25 – 30 DC millivolts"';
const REPLACE_SOURCE = 'from memory: replace below about 18 mV open circuit';
const CLOSED_SOURCE = "closed-circuit minimums vary by gas valve: the valve manufacturer's instructions govern";

export type ThermocoupleAssessment = {
  status: 'replace' | 'below_typical' | 'typical' | 'above_typical' | 'see_manufacturer';
  reason: string;
  source: string;
};

export function assessThermocoupleMillivolts(input: { openCircuitMv?: number; closedCircuitMv?: number }): ThermocoupleAssessment {
  const open = input.openCircuitMv === undefined ? undefined : requireReading('openCircuitMv', input.openCircuitMv);
  const closed = input.closedCircuitMv === undefined ? undefined : requireReading('closedCircuitMv', input.closedCircuitMv);
  const closedNote = closed === undefined ? '' : ` Closed circuit ${closed} mV: ${CLOSED_SOURCE}.`;
  const { min, max } = THERMOCOUPLE_TYPICAL_OPEN_CIRCUIT_MV;

  if (open === undefined) {
    return {
      status: 'see_manufacturer',
      reason:
        closed === undefined
          ? 'No reading given.'
          : `Closed circuit ${closed} mV: compare with the gas valve manufacturer's minimum; no general limit applies.`,
      source: CLOSED_SOURCE,
    };
  }
  if (open < THERMOCOUPLE_REPLACE_BELOW_OPEN_CIRCUIT_MV) {
    return {
      status: 'replace',
      reason: `Open circuit ${open} mV is below about ${THERMOCOUPLE_REPLACE_BELOW_OPEN_CIRCUIT_MV} mV: replace the thermocouple.${closedNote}`,
      source: `${REPLACE_SOURCE}; ${TYPICAL_SOURCE}`,
    };
  }
  if (open < min) {
    return {
      status: 'below_typical',
      reason: `Open circuit ${open} mV is below the typical ${min}–${max} mV but above the replacement point.${closedNote}`,
      source: `${TYPICAL_SOURCE}; ${REPLACE_SOURCE}`,
    };
  }
  return {
    status: open > max ? 'above_typical' : 'typical',
    reason: `Open circuit ${open} mV (typical ${min}–${max} mV).${closedNote}`,
    source: TYPICAL_SOURCE,
  };
}

/** A thermocouple judged "replace" is a failed safety component, so it raises a flag like any other. */
export function thermocoupleFlags(assessment: ThermocoupleAssessment, openCircuitMv: number | null): TradeFlag[] {
  if (assessment.status !== 'replace') return [];
  return [
    {
      code: 'thermocouple_replace',
      severity: 'warning',
      message:
        `${assessment.reason} A weak thermocouple can let the pilot safety drop out or fail to hold the gas valve open; ` +
        "replace it and test the pilot safety to the gas valve manufacturer's instructions.",
      value: openCircuitMv,
      threshold: THERMOCOUPLE_REPLACE_BELOW_OPEN_CIRCUIT_MV,
      unit: 'mV open circuit',
      source: assessment.source,
    },
  ];
}
