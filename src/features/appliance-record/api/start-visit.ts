import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api-client';
import { meQueryOptions } from '@/lib/auth';
import { currentOutbox } from '@/lib/offline/offline-session';
import { applianceKeys, applianceRecordQueryOptions } from '@/lib/resources/appliances';
import { checklistTemplatesQueryOptions } from '@/lib/resources/checklist-templates';
import { todayInTimeZone } from '@shared/dates';
import type { VisitType } from '@shared/schemas/enums';
import type { ApplianceRecordDto } from '@shared/schemas/records';
import type { VisitDto } from '@shared/schemas/visits';
import { chooseChecklistTemplate, requiredReadingsFor } from '@shared/visits/required-readings';

export type StartVisitInput = { applianceId: string; type: VisitType; bookingId?: string };

export const startVisit = (input: StartVisitInput & { id?: string }) => api<VisitDto>('/visits', { method: 'POST', body: input });

const notSaved = (what: string) => new ApiError(0, 'offline', `No signal, and ${what} was not saved on this phone. Open the round once with signal to save it.`);

/**
 * A visit started with no signal: the phone picks its id and builds it from the saved record and checklist template
 * (as the server would), and the start waits in the outbox; every later write of the visit queues behind it.
 */
async function startOnPhone(qc: QueryClient, input: StartVisitInput): Promise<VisitDto> {
  const outbox = currentOutbox();
  const record = qc.getQueryData(applianceRecordQueryOptions(input.applianceId).queryKey);
  const me = qc.getQueryData(meQueryOptions().queryKey);
  const templates = qc.getQueryData(checklistTemplatesQueryOptions().queryKey);
  if (!outbox || !me?.company) throw new ApiError(0, 'offline', 'No signal: starting a visit needs signal once after signing in.');
  if (!record) throw notSaved('this life record');
  const template = templates && chooseChecklistTemplate(templates, record.appliance.kind, record.appliance.fuel);
  if (!template) throw notSaved('the checklist for this appliance');
  const id = crypto.randomUUID();
  const arrivedAt = new Date().toISOString();
  const visitedOn = todayInTimeZone(me.company.timeZone);
  const localVisit: VisitDto = {
    id,
    applianceId: record.appliance.id,
    type: input.type,
    status: 'draft',
    visitedOn,
    technicians: [{ id: me.user.id, name: me.user.name }],
    arrivedAt,
    departedAt: null,
    checklist: template.items.map((item) => ({ ...item, mark: null, note: '' })),
    readings: {},
    requiredReadings: requiredReadingsFor(template, input.type),
    readingSkips: {},
    results: {},
    outcomeRequired: false,
    findings: '',
    recommendations: '',
    internalNotes: '',
    outcome: null,
    outcomeReason: null,
    outcomeToldWhom: null,
    outcomeToldAt: null,
    signedOffBy: null,
    signedOffAt: null,
    customerAckName: null,
    completedAt: null,
    revision: 0,
    swaps: [],
    amendments: [],
  };
  await outbox.add({
    kind: 'visit-start',
    visitId: id,
    label: `Start the visit · ${record.customer.name}, ${record.site.street}`,
    request: { method: 'POST', path: '/visits', body: { id, applianceId: input.applianceId, type: input.type, visitedOn, arrivedAt, bookingId: input.bookingId } },
    meta: { localVisit, applianceId: input.applianceId },
  });
  return localVisit;
}

async function startOrQueue(qc: QueryClient, input: StartVisitInput): Promise<VisitDto> {
  if (currentOutbox() && navigator.onLine === false) return startOnPhone(qc, input);
  try {
    return await startVisit(input);
  } catch (e) {
    if (currentOutbox() && e instanceof ApiError && (e.offline || e.status >= 500)) return startOnPhone(qc, input);
    throw e;
  }
}

export function useStartVisit() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: StartVisitInput) => startOrQueue(qc, input),
    // Not paused for lack of signal: with none, the visit starts on the phone.
    networkMode: 'always',
    onSuccess: (visit) => {
      qc.setQueryData(['visit', visit.id], visit);
      // "Continue visit" on the record, even before the server has it.
      qc.setQueryData(applianceKeys.record(visit.applianceId), (r: ApplianceRecordDto | undefined) => (r ? { ...r, openDraftVisitId: visit.id } : r));
      if (navigator.onLine) return qc.invalidateQueries({ queryKey: applianceKeys.record(visit.applianceId) });
    },
  });
}
