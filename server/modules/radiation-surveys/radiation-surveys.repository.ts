import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { radiationSurveyRadiators, radiationSurveyRooms, radiationSurveys, users } from '../../db/schema/index';

const summaryColumns = {
  id: radiationSurveys.id,
  surveyedOn: radiationSurveys.surveyedOn,
  surveyedBy: users.name,
  system: radiationSurveys.system,
  designWaterF: radiationSurveys.designWaterF,
  totalEdrSqFt: radiationSurveys.totalEdrSqFt,
  notes: radiationSurveys.notes,
  createdAt: radiationSurveys.createdAt,
};

export type SurveyRow = typeof radiationSurveys.$inferInsert;
export type RoomRow = typeof radiationSurveyRooms.$inferInsert;
export type RadiatorRow = typeof radiationSurveyRadiators.$inferInsert;

export const radiationSurveysRepository = {

  list(db: DbOrTx, companyId: string, applianceId: string) {
    return db
      .select(summaryColumns)
      .from(radiationSurveys)
      .leftJoin(users, eq(users.id, radiationSurveys.surveyedBy))
      .where(and(eq(radiationSurveys.companyId, companyId), eq(radiationSurveys.applianceId, applianceId)))
      .orderBy(desc(radiationSurveys.surveyedOn), desc(radiationSurveys.createdAt));
  },

  async latestWithRooms(db: DbOrTx, companyId: string, applianceId: string) {
    const [survey] = await this.list(db, companyId, applianceId).limit(1);
    if (!survey) return null;
    const rooms = await db.select().from(radiationSurveyRooms).where(eq(radiationSurveyRooms.surveyId, survey.id)).orderBy(asc(radiationSurveyRooms.position));
    const radiators = rooms.length
      ? await db
          .select()
          .from(radiationSurveyRadiators)
          .where(inArray(radiationSurveyRadiators.roomId, rooms.map((r) => r.id)))
          .orderBy(asc(radiationSurveyRadiators.position))
      : [];
    return { survey, rooms, radiators };
  },

  async insert(db: DbOrTx, survey: SurveyRow, rooms: { room: Omit<RoomRow, 'surveyId'>; radiators: Omit<RadiatorRow, 'roomId'>[] }[]) {
    const [created] = await db.insert(radiationSurveys).values(survey).returning({ id: radiationSurveys.id });
    const roomRows = await db
      .insert(radiationSurveyRooms)
      .values(rooms.map(({ room }) => ({ ...room, surveyId: created!.id })))
      .returning({ id: radiationSurveyRooms.id, position: radiationSurveyRooms.position });
    const idByPosition = new Map(roomRows.map((r) => [r.position, r.id]));
    const radiatorRows = rooms.flatMap(({ room, radiators }) => radiators.map((r) => ({ ...r, roomId: idByPosition.get(room.position)! })));
    await db.insert(radiationSurveyRadiators).values(radiatorRows);
    return created!.id;
  },
};
