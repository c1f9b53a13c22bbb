import { describe, it, expect } from 'vitest';
import * as trade from '../../../shared/trade';

describe('shared/trade index', () => {
  it('re-exports the public computations', () => {
    const functions = [
      'fahrenheitToCelsius', 'celsiusToFahrenheit', 'inWcToPascal', 'pascalToInWc', 'psiToKpa',
      'analyzeCombustion', 'combustionEfficiencyPct', 'excessAirPctFromO2', 'airFreeCoPpm', 'co2PctFromO2', 'siegertFlueLossPct',
      'clockGasInput', 'compareInputToRating',
      'analyzeMakeupWater',
      'parseGaugeGlassLevel', 'assessGaugeGlassLevel',
      'assessThermocoupleMillivolts',
      'medianServiceLifeYears', 'applianceLifeStatus',
      'computeComponentDue', 'formatSpec',
      'TradeInputError',
    ] as const;
    for (const name of functions) expect(typeof trade[name], name).toBe('function');
    expect(trade.DEFAULT_HEATING_VALUE_BTU_PER_FT3.natural_gas).toBe(1026);
    expect(Object.keys(trade.DEFAULT_DUE_RULES)).toHaveLength(trade.COMPONENT_TYPE_CODES.length);
    expect(trade.GAUGE_GLASS_LOWEST_VISIBLE_ABOVE_LOWEST_PERMISSIBLE_IN).toBe(1);
  });

  it('TradeInputError carries the field', () => {
    const error = new trade.TradeInputError('o2Pct', 'too high');
    expect(error).toBeInstanceOf(Error);
    expect(error.field).toBe('o2Pct');
    expect(error.name).toBe('TradeInputError');
  });
});
