import { describe, expect, it } from 'vitest';
import { DEFAULT_CHECKLISTS } from '../../server/modules/checklists/default-checklists';
import { requiredReadingsFor } from '../../server/modules/checklists/required-readings';
import { checklistTemplateInput } from '../../shared/schemas/records';

describe('seeded checklist templates', () => {
  it('each passes the same validation a manager’s edit must pass, so a seeded template can be saved unchanged', () => {
    for (const template of DEFAULT_CHECKLISTS) {
      const result = checklistTemplateInput.safeParse({ name: template.name, items: template.items, requiredReadings: template.requiredReadings });
      expect({ name: template.name, issues: result.success ? [] : result.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`) }).toEqual({
        name: template.name,
        issues: [],
      });
    }
  });

  it('require the combustion test on every annual visit and the low-water cutoff test on steam, each recorded by an item', () => {
    // common practice: an annual service of a fired boiler includes an analyzer combustion test; a steam boiler's a low-water cutoff test.
    for (const template of DEFAULT_CHECKLISTS) {
      const expected = template.applianceKind === 'steam_boiler' ? ['combustion', 'lowWaterCutoff'] : ['combustion'];
      expect(requiredReadingsFor(template, 'annual_maintenance')).toEqual(expected);
      expect(template.requiredReadings.annual_maintenance).toEqual(expected);
      expect(requiredReadingsFor(template, 'repair')).toEqual([]);
    }
  });

  it('a required reading no item records is not required of a visit', () => {
    const template = { items: [{ key: 'a', section: 'S', label: 'A', readings: ['combustion'] }], requiredReadings: { annual_maintenance: ['combustion', 'lowWaterCutoff'] } };
    expect(requiredReadingsFor(template, 'annual_maintenance')).toEqual(['combustion']);
  });
});
