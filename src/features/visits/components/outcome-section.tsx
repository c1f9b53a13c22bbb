import { Notice } from '@/components/ui/notice';
import type { VisitOutcome } from '@shared/schemas/enums';
import { ChoiceButtons, Panel, TextArea, TextInput } from './inputs';
import { useDraft } from './draft-context';

const pad = (n: number) => String(n).padStart(2, '0');
/** An ISO instant as the value of a datetime-local input, in the phone's own time. */
function toLocalInput(iso: string | null) {
  if (!iso) return '';
  const d = new Date(iso);
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

export function OutcomeSection({ required, serverErrors }: { required: boolean; serverErrors: Record<string, string[]> }) {
  const { fields, edit } = useDraft();
  const set = (patch: Partial<typeof fields>) => edit((f) => ({ ...f, ...patch }));
  return (
    <Panel title="Outcome" id="outcome">
      {required && !fields.outcome && (
        <Notice kind="danger" title="Choose an outcome">
          A failed test or a stop reading is recorded on this visit. Say whether the appliance was left operating or shut down.
        </Notice>
      )}
      <ChoiceButtons<VisitOutcome>
        label="Outcome"
        choices={[
          { value: 'left_operating', label: 'Left operating', icon: '✓', tone: 'ok' },
          { value: 'shut_down_unsafe', label: 'Shut down as unsafe', icon: '✖', tone: 'due' },
        ]}
        value={fields.outcome}
        onChange={(outcome) =>
          set({ outcome, outcomeToldAt: outcome === 'shut_down_unsafe' ? (fields.outcomeToldAt ?? new Date().toISOString()) : fields.outcomeToldAt })
        }
        clearable
      />
      {serverErrors.outcome?.map((m) => (
        <p key={m} role="alert" className="text-sm font-semibold text-due">
          ⚠ {m}
        </p>
      ))}
      {fields.outcome === 'shut_down_unsafe' && (
        <>
          <Notice kind="caution" title="Make it safe">
            Turn off and tag the gas or oil supply and the power, and tell the people in the building not to relight it. Follow the manufacturer&apos;s
            instructions, local codes and licensed practice.
          </Notice>
          <TextArea label="Why it was shut down" value={fields.outcomeReason} onChange={(outcomeReason) => set({ outcomeReason })} maxLength={2000} error={serverErrors.outcomeReason} />
          <TextInput label="Who was told" value={fields.outcomeToldWhom} onChange={(outcomeToldWhom) => set({ outcomeToldWhom })} maxLength={200} error={serverErrors.outcomeToldWhom} />
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
