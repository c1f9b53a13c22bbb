import type { RadiationSurveyInput, RadiatorInput } from '@shared/schemas/radiation-surveys';
import type { HeatingMedium } from '@shared/trade/boiler-sizing';
import type { RadiatorDraft } from './radiator-fields';

export type RoomDraft = { key: string; name: string; radiators: RadiatorDraft[] };
export type SurveyDraft = { surveyedOn: string; system: HeatingMedium; designWaterF: string; notes: string; rooms: RoomDraft[] };

// An empty box stays undefined, so the schema says "Enter the …" rather than treating it as 0.
const num = (s: string) => (s.trim() === '' ? undefined : Number(s));

export function radiatorInputOf(d: RadiatorDraft): RadiatorInput {
  const count = num(d.count);
  switch (d.type) {
    case 'cast_iron_column':
      return { type: d.type, columns: num(d.columns)!, heightIn: num(d.heightIn)!, sections: num(d.sections)!, count };
    case 'tube':
      return { type: d.type, tubes: num(d.tubes)!, heightIn: num(d.heightIn)!, sections: num(d.sections)!, count };
    case 'wall':
      return { type: d.type, size: d.size as '9-A', sections: num(d.sections)!, count };
    case 'convector':
      return { type: d.type, ratedEdrSqFt: num(d.ratedEdrSqFt)!, count };
    case 'baseboard':
      return { type: d.type, lengthFt: num(d.lengthFt)!, ratedEdrSqFtPerFt: num(d.ratedEdrSqFtPerFt)!, count };
  }
}

export function surveyInputOf(d: SurveyDraft): RadiationSurveyInput {
  return {
    surveyedOn: d.surveyedOn,
    system: d.system,
    designWaterF: d.system === 'hot_water' ? num(d.designWaterF) : null,
    notes: d.notes,
    rooms: d.rooms.map((r) => ({ name: r.name, radiators: r.radiators.map(radiatorInputOf) })),
  };
}
