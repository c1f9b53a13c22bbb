import type { AppContext } from '../../context';
import type { DbOrTx } from '../../db/client';
import { conflict, notFound, validationFailed } from '../../lib/http-error';
import { radiatorEdrSqFt } from '../../../shared/trade/radiator-edr';
import { STEAM_BTUH_PER_SQFT_EDR, waterBtuhPerSqFtEdr } from '../../../shared/trade/boiler-sizing';
import {
  sizeSurvey,
  toTradeRadiator,
  type LatestRadiationSurveyDto,
  type RadiationSurveyDto,
  type RadiationSurveyParsed,
  type RadiationSurveySummaryDto,
  type RadiatorDto,
  type RadiatorParsed,
} from '../../../shared/schemas/radiation-surveys';
import { recordAudit } from '../../core/audit-log';
import { companyToday } from '../../core/company-today';
import { radiationSurveysRepository as repo, type RadiatorRow } from './radiation-surveys.repository';
import { findAppliance } from '../../core/tenant-finders';

const SURVEYED_KINDS = new Set(['steam_boiler', 'hot_water_boiler']);
const round2 = (n: number) => Math.round(n * 100) / 100;

type StoredRadiator = Awaited<ReturnType<typeof repo.latestWithRooms>> extends infer T ? (T extends { radiators: (infer R)[] } ? R : never) : never;

function radiatorColumns(r: RadiatorParsed): Omit<RadiatorRow, 'roomId' | 'position' | 'edrSqFt'> {
  const none = { columns: null, tubes: null, heightIn: null, sections: null, wallSize: null, ratedEdrSqFt: null, lengthFt: null, ratedEdrSqFtPerFt: null };
  switch (r.type) {
    case 'cast_iron_column':
      return { ...none, type: r.type, columns: r.columns, heightIn: r.heightIn, sections: r.sections, count: r.count };
    case 'tube':
      return { ...none, type: r.type, tubes: r.tubes, heightIn: r.heightIn, sections: r.sections, count: r.count };
    case 'wall':
      return { ...none, type: r.type, wallSize: r.size, sections: r.sections, count: r.count };
    case 'convector':
      return { ...none, type: r.type, ratedEdrSqFt: r.ratedEdrSqFt, count: r.count };
    case 'baseboard':
      return { ...none, type: r.type, lengthFt: r.lengthFt, ratedEdrSqFtPerFt: r.ratedEdrSqFtPerFt, count: r.count };
  }
}

function radiatorDto(row: StoredRadiator): RadiatorDto {
  const base = { id: row.id, count: row.count, edrSqFt: row.edrSqFt };
  switch (row.type) {
    case 'cast_iron_column':
      return { ...base, type: row.type, columns: row.columns!, heightIn: row.heightIn!, sections: row.sections! };
    case 'tube':
      return { ...base, type: row.type, tubes: row.tubes!, heightIn: row.heightIn!, sections: row.sections! };
    case 'wall':
      return { ...base, type: row.type, size: row.wallSize as '5-A', sections: row.sections! };
    case 'convector':
      return { ...base, type: row.type, ratedEdrSqFt: row.ratedEdrSqFt! };
    case 'baseboard':
      return { ...base, type: row.type, lengthFt: row.lengthFt!, ratedEdrSqFtPerFt: row.ratedEdrSqFtPerFt! };
  }
}

function summaryDto(s: { id: string; surveyedOn: string; surveyedBy: string | null; system: 'steam' | 'hot_water'; designWaterF: number | null; totalEdrSqFt: number; createdAt: Date }): RadiationSurveySummaryDto {
  return { id: s.id, surveyedOn: s.surveyedOn, surveyedBy: s.surveyedBy, system: s.system, designWaterF: s.designWaterF, totalEdrSqFt: s.totalEdrSqFt, createdAt: s.createdAt.toISOString() };
}

async function applianceOrThrow(db: DbOrTx, companyId: string, applianceId: string) {
  const appliance = await findAppliance(db, companyId, applianceId);
  if (!appliance) throw notFound('Appliance');
  return appliance;
}

export function radiationSurveysService(ctx: AppContext) {
  async function latest(db: DbOrTx, companyId: string, applianceId: string): Promise<RadiationSurveyDto | null> {
    const appliance = await applianceOrThrow(db, companyId, applianceId);
    const found = await repo.latestWithRooms(db, companyId, applianceId);
    if (!found) return null;
    const { survey, rooms, radiators } = found;
    const roomDtos = rooms.map((room) => {
      const own = radiators.filter((r) => r.roomId === room.id).map(radiatorDto);
      return { id: room.id, name: room.name, edrSqFt: round2(own.reduce((sum, r) => sum + r.edrSqFt, 0)), radiators: own };
    });
    const sizing = sizeSurvey({ system: survey.system, designWaterF: survey.designWaterF, totalEdrSqFt: survey.totalEdrSqFt });
    const btuhPerSqFtEdr = survey.system === 'steam' ? STEAM_BTUH_PER_SQFT_EDR : Math.round(waterBtuhPerSqFtEdr(survey.designWaterF ?? 170));
    return {
      ...summaryDto(survey),
      notes: survey.notes,
      rooms: roomDtos,
      sizing: { ...sizing, btuhPerSqFtEdr },
      nameplate: { inputBtuh: appliance.inputBtuh, grossOutputBtuh: appliance.grossOutputBtuh },
    };
  }

  return {
    async list(companyId: string, applianceId: string): Promise<RadiationSurveySummaryDto[]> {
      await applianceOrThrow(ctx.db, companyId, applianceId);
      return (await repo.list(ctx.db, companyId, applianceId)).map(summaryDto);
    },

    latest: async (companyId: string, applianceId: string): Promise<LatestRadiationSurveyDto> => ({ survey: await latest(ctx.db, companyId, applianceId) }),

    /** Records a new survey; it becomes the latest, the earlier ones stay in the list. */
    async create(actor: { companyId: string; userId: string }, applianceId: string, input: RadiationSurveyParsed): Promise<RadiationSurveyDto> {
      return ctx.db.transaction(async (tx) => {
        const appliance = await applianceOrThrow(tx, actor.companyId, applianceId);
        if (!SURVEYED_KINDS.has(appliance.kind)) throw conflict('A radiation survey is taken for a steam or hot-water boiler only.');
        const today = await companyToday(tx, actor.companyId);
        if (input.surveyedOn > today) throw validationFailed({ surveyedOn: ['A survey cannot be dated in the future.'] });
        const rooms = input.rooms.map((room, i) => ({
          room: { position: i, name: room.name },
          radiators: room.radiators.map((r, j) => ({
            ...radiatorColumns(r),
            position: j,
            edrSqFt: round2(radiatorEdrSqFt(toTradeRadiator(r), `rooms.${i}.radiators.${j}`) * r.count),
          })),
        }));
        const totalEdrSqFt = round2(rooms.flatMap((r) => r.radiators).reduce((sum, r) => sum + r.edrSqFt, 0));
        const designWaterF = input.system === 'hot_water' ? (input.designWaterF ?? null) : null;
        // Also refuses a total beyond the sizing table's range as a field error, before anything is written.
        sizeSurvey({ system: input.system, designWaterF, totalEdrSqFt });
        const id = await repo.insert(
          tx,
          { companyId: actor.companyId, applianceId, surveyedOn: input.surveyedOn, surveyedBy: actor.userId, system: input.system, designWaterF, notes: input.notes ?? null, totalEdrSqFt },
          rooms,
        );
        await recordAudit(tx, {
          companyId: actor.companyId,
          actorId: actor.userId,
          action: 'create',
          entity: 'radiation_survey',
          entityId: id,
          changes: { applianceId, surveyedOn: input.surveyedOn, system: input.system, rooms: input.rooms.length, totalEdrSqFt },
        });
        return (await latest(tx, actor.companyId, applianceId))!;
      });
    },
  };
}
