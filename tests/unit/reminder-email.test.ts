import { describe, expect, it } from 'vitest';
import { describeLine, type ReminderLine } from '../../server/modules/reminders/reminder-email';

const line = (over: Partial<ReminderLine>): ReminderLine => ({
  kind: 'part_due',
  dueOn: '2026-12-10',
  partLabel: 'circulator',
  dueKind: 'replacement',
  appliance: { kind: 'hot_water_boiler', fuel: 'natural_gas', street: '4 Invented Lane', town: 'Wrenfield' },
  ...over,
});

describe('reminder wording says why a part is due', () => {
  // Source: ASHRAE Handbook, HVAC Applications, service-life table (secondary copy): the medians describe populations,
  // not one unit, so a reminder never calls a part due for replacement by its age; it says condition or interval.
  it('a part found failing says so', () => {
    expect(describeLine(line({ failedOnCondition: true }), '2026-12-01')).toBe(
      'Hot-water boiler (natural gas) at 4 Invented Lane, Wrenfield: the circulator was found worn or failing at the last visit and needs replacing, which is due on December 10, 2026.',
    );
  });

  it('a part on a set replacement interval says it has not been found faulty', () => {
    const text = describeLine(line({ failedOnCondition: false, partLabel: 'oil nozzle' }), '2026-12-20');
    expect(text).toMatch(/the oil nozzle is due for replacement on its set replacement interval \(it has not been found faulty\), which was due on December 10, 2026\.$/);
    expect(text).not.toMatch(/overdue|old|age/i);
  });

  it('an inspection is a check', () => {
    expect(describeLine(line({ dueKind: 'inspection' }), '2026-12-01')).toMatch(/the circulator needs a check, which is due on December 10, 2026\.$/);
  });
});
