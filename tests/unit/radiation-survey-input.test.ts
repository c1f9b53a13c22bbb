import { describe, expect, it } from 'vitest';
import { radiationSurveyInput, radiatorLineEdrSqFt, runningTotalEdrSqFt } from '../../shared/schemas/radiation-surveys';

describe('radiation survey input', () => {
  it('rates a line of identical radiators and keeps a running total that skips the half-typed ones', () => {
    // from memory: Holohan, "The Lost Art of Steam Heating": 2-column 38 in = 4 sq ft per section → 12 sections, 3 alike: 144.
    expect(radiatorLineEdrSqFt({ type: 'cast_iron_column', columns: 2, heightIn: 38, sections: 12, count: 3 })).toBe(144);
    // from memory: same table: 4-column 45 in = 10 sq ft per section.
    const rooms = [{ radiators: [{ type: 'cast_iron_column' as const, columns: 4, heightIn: 45, sections: 5 }, { type: 'tube' as const, tubes: 4, heightIn: 32, sections: Number.NaN }] }];
    expect(radiatorLineEdrSqFt(rooms[0]!.radiators[1]!)).toBeNull();
    expect(runningTotalEdrSqFt(rooms)).toBe(50);
  });

  it('names the radiator field a table does not list, down to the room and radiator', () => {
    const r = radiationSurveyInput.safeParse({
      surveyedOn: '2026-11-18',
      system: 'steam',
      rooms: [{ name: 'Hall', radiators: [{ type: 'tube', tubes: 4, heightIn: 32, sections: 4 }] }, { name: 'Den', radiators: [{ type: 'tube', tubes: 3, heightIn: 45, sections: 4 }] }],
    });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join('.'))).toEqual(['rooms.1.radiators.0.heightIn']);
    expect(r.error!.issues[0]!.message).toBe('No rating for 45 in; listed heights: 20, 23, 26, 32, 38 in.');
  });

  it('refuses a survey whose total is beyond one boiler', () => {
    const r = radiationSurveyInput.safeParse({
      surveyedOn: '2026-11-18',
      system: 'steam',
      rooms: Array.from({ length: 3 }, (_, i) => ({ name: `Hall ${i}`, radiators: [{ type: 'convector', ratedEdrSqFt: 400, count: 20 }] })),
    });
    expect(r.error!.issues.map((i) => i.path.join('.'))).toEqual(['rooms']);
  });
});
