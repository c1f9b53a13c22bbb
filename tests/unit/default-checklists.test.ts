import { describe, expect, it } from 'vitest';
import { DEFAULT_CHECKLISTS } from '../../server/modules/checklists/default-checklists';
import { checklistTemplateInput } from '../../shared/schemas/records';

describe('seeded checklist templates', () => {
  it('each passes the same validation a manager’s edit must pass, so a seeded template can be saved unchanged', () => {
    for (const template of DEFAULT_CHECKLISTS) {
      const result = checklistTemplateInput.safeParse({ name: template.name, items: template.items });
      expect({ name: template.name, issues: result.success ? [] : result.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`) }).toEqual({
        name: template.name,
        issues: [],
      });
    }
  });
});
