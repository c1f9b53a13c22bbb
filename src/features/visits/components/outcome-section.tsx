import { Notice } from '@/components/ui/notice';
import type { VisitOutcome } from '@shared/schemas/enums';
import { ChoiceButtons, Panel, TextArea, TextInput } from './inputs';
import { useDraft } from './draft-context';
import { OUTCOME_LABELS } from '@shared/glossary';

const pad = (n: number) => String(n).padStart(2, '0');
/** An ISO instant as the value of a datetime-local input, in the phone's own time. */
function toLocalInput(iso: string | null) {
  if (!iso) return '';
  const d = new Date(iso);
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/**
 * The outcome, and beside it what the occupant was told: always for "shut down as unsafe", and for any warning or stop
 * found on the visit whichever outcome is chosen.
 */
export function OutcomeSection({ alerts, serverErrors }: { alerts: string[]; serverErrors: Record<string, string[]> }) {
  const { fields, edit } = useDraft();
  const set = (patch: Partial<typeof fields>) => edit((f) => ({ ...f, ...patch }));
  const shutDown = fields.outcome === 'shut_down_unsafe';
  const warned = alerts.length > 0;
  const now = () => new Date().toISOString();
  return (
    <Panel title="Outcome" id="outcome">
      {warned && (
        <Notice kind="danger" title={fields.outcome ? 'Tell the occupant' : 'Choose an outcome'}>
          {alerts.join(' ')} Say whether the appliance was left operating or shut down, who was told and what they were told.
        </Notice>
      )}
      <div data-field="outcome">
        <ChoiceButtons<VisitOutcome>
          label="Outcome"
          choices={[
            { value: 'left_operating', label: OUTCOME_LABELS.left_operating, icon: '✓', tone: 'ok' },
            { value: 'shut_down_unsafe', label: OUTCOME_LABELS.shut_down_unsafe, icon: '✖', tone: 'due' },
          ]}
          value={fields.outcome}
          onChange={(outcome) => set({ outcome, outcomeToldAt: outcome === 'shut_down_unsafe' || warned ? (fields.outcomeToldAt ?? now()) : fields.outcomeToldAt })}
          clearable
        />
      </div>
      {serverErrors.outcome?.map((m) => (
        <p key={m} role="alert" className="text-sm font-semibold text-due">
          ⚠ {m}
        </p>
      ))}
      {shutDown && (
        <Notice kind="caution" title="Make it safe">
          Turn off and tag the gas or oil supply and the power, and tell the people in the building not to relight it. Follow the manufacturer&apos;s
          instructions, local codes and licensed practice.
        </Notice>
      )}
      {(shutDown || warned) && (
        <>
          <TextArea
            label={shutDown ? 'Why it was shut down' : 'What the occupant was told'}
            value={fields.outcomeReason}
            onChange={(outcomeReason) => set({ outcomeReason })}
            maxLength={2000}
            error={serverErrors.outcomeReason}
            field="outcomeReason"
          />
          <TextInput
            label="Who was told"
            value={fields.outcomeToldWhom}
            onChange={(outcomeToldWhom) => set({ outcomeToldWhom, outcomeToldAt: fields.outcomeToldAt ?? now() })}
            maxLength={200}
            error={serverErrors.outcomeToldWhom}
            field="outcomeToldWhom"
          />
          <TextInput
            label="When they were told"
            type="datetime-local"
            value={toLocalInput(fields.outcomeToldAt)}
            onChange={(v) => set({ outcomeToldAt: v ? new Date(v).toISOString() : null })}
            error={serverErrors.outcomeToldAt}
          />
        </>
      )}
    </Panel>
  );
}

export function NotesSection({ serverErrors }: { serverErrors: Record<string, string[]> }) {
  const { fields, edit } = useDraft();
  const set = (patch: Partial<typeof fields>) => edit((f) => ({ ...f, ...patch }));
  return (
    <Panel title="Findings and recommendations">
      <TextArea label="Findings" value={fields.findings} onChange={(findings) => set({ findings })} error={serverErrors.findings} rows={4} />
      <TextArea label="Recommendations" value={fields.recommendations} onChange={(recommendations) => set({ recommendations })} error={serverErrors.recommendations} />
      <TextArea label="Notes for the office (not shown to the customer)" value={fields.internalNotes} onChange={(internalNotes) => set({ internalNotes })} rows={2} />
      <TextInput
        label="Customer's acknowledgement (their name)"
        value={fields.customerAckName}
        onChange={(customerAckName) => set({ customerAckName })}
        maxLength={160}
        error={serverErrors.customerAckName}
        hint="Ask the customer to type their name once you have explained the findings."
      />
    </Panel>
  );
}
