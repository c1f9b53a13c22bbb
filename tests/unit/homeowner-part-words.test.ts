import { describe, expect, it } from 'vitest';
import { MEANING, isOrAre } from '../../server/modules/homeowner/homeowner-view';

// English agreement of "is"/"are" with the part's noun: common practice (plain-language writing for homeowners).
describe("the homeowner's sentence about a part coming due", () => {
  it('agrees with a plural part name and a singular one', () => {
    expect(isOrAre('ignition electrodes')).toBe('are');
    expect(isOrAre('burners')).toBe('are');
    expect(isOrAre('cad cell (flame detector)')).toBe('is');
    expect(isOrAre('flame sensor (flame rod)')).toBe('is');
    expect(isOrAre('oil fuel pump')).toBe('is');
    expect(isOrAre('pressuretrol, 0.5–9 psi')).toBe('is');
    expect(isOrAre('gauge glass')).toBe('is');
  });

  it('says so in the whole sentence', () => {
    expect(MEANING.inspection('ignition electrodes')).toBe('The ignition electrodes are due to be checked at the next service.');
    expect(MEANING.replacement('burners')).toBe('The burners are due to be replaced. They wear with age or have shown wear; your technician will replace them.');
    expect(MEANING.replacement('oil burner nozzle')).toBe('The oil burner nozzle is due to be replaced. It wears with age or has shown wear; your technician will replace it.');
  });
});
