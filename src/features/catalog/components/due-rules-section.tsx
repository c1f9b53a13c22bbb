import { useState, type FormEvent } from 'react';
import { dueRuleInput, type DueRuleDto } from '@shared/schemas/due';
import { LABELS } from '@shared/schemas/enums';
import { DUE_RULE_BASES, REPLACEMENT_POLICIES, type DueRuleBasis, type ReplacementPolicy } from '@shared/trade';
import { Card } from '@/components/ui/card';
import { FormActions } from '@/components/ui/form-actions';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { Spinner } from '@/components/ui/page';
import { StatusBadge, type Status } from '@/components/ui/status-badge';
import type { FieldErrors } from '@/lib/api-client';
import { useDueRules } from '../api/list-due-rules';
import { useUpdateDueRule } from '../api/update-due-rule';
import { useServiceLife } from '../api/list-service-life';
import type { ServiceLifeDto } from '@shared/schemas/service-life';
import { LearnedLife } from './learned-life';
import { describeFailure, unclaimedErrors, zodFieldErrors } from '@/lib/form-errors';
import { useFocusFirstError } from '@/lib/use-focus-first-error';
import { RECORD_WORDS } from '@shared/glossary';

const BASIS: Record<DueRuleBasis, { label: string; status: Status }> = {
  published: { label: 'Published source', status: 'ok' },
  common_practice: { label: 'Common practice', status: 'info' },
  manufacturer: { label: "Manufacturer's instructions govern", status: 'soon' },
  company_policy: { label: 'Company policy', status: 'info' },
  learned: { label: 'Learned from our fleet', status: 'ok' },
};
const POLICY: Record<ReplacementPolicy, string> = {
  on_condition: 'Replace when found failing',
  fixed_age: 'Replace at a fixed age',
  annual: 'Replace every year',
};

export function DueRulesSection() {
  const rules = useDueRules();
  const learned = useServiceLife();
  const byType = new Map((learned.data ?? []).map((e) => [e.componentType, e]));
  return (
    <Card title={<span id="due-rules">{RECORD_WORDS.dueRules}</span>}>
      <p className="mb-3 text-sm text-iron-muted">
        How often each part is inspected and when it is replaced, and what that rule rests on. Saving a rule recomputes
        every due date in the company. Where the manufacturer&rsquo;s instructions say otherwise, they govern. Beside a rule,
        the service life learned from our own part swaps, with its 95 % interval, once any part of that type has worn out.
      </p>
      {rules.isPending && <Spinner />}
      {rules.isError && <Notice kind="danger" title="Could not load the due rules">{rules.error.message}</Notice>}
      <ul className="divide-y divide-plate-line rounded-plate border border-plate-line">
        {rules.data?.map((r) => (
          <DueRuleRow key={r.id} rule={r} learned={byType.get(r.componentType)} />
        ))}
      </ul>
    </Card>
  );
}

const kindText = (r: DueRuleDto) => (r.applianceKind ? LABELS.applianceKind[r.applianceKind].toLowerCase() : 'every appliance');
/** Unique per rule: a part may have one rule for every appliance and others for particular kinds. */
const ruleName = (r: DueRuleDto) => `${r.typeLabel}, ${kindText(r)}`;

const describeRule = (r: DueRuleDto) =>
  [
    r.inspectionIntervalMonths ? `Inspect every ${r.inspectionIntervalMonths} months` : 'No set inspection interval',
    r.replacementPolicy === 'fixed_age' && r.replacementAgeYears ? `replace at ${r.replacementAgeYears} years` : POLICY[r.replacementPolicy].toLowerCase(),
  ].join(' · ');

function DueRuleRow({ rule, learned }: { rule: DueRuleDto; learned?: ServiceLifeDto }) {
  const [editing, setEditing] = useState(false);
  return (
    <li className="px-3 py-2">
      <div className="flex flex-wrap items-center gap-3">
        <div className="min-w-48 flex-1">
          <p className="font-semibold">
            {rule.typeLabel}
            <span className="font-normal text-iron-muted"> · {kindText(rule)}</span>
          </p>
          <p className="text-sm">{describeRule(rule)}</p>
          <p className="text-xs text-iron-muted">Source: {rule.source}</p>
        </div>
        <StatusBadge status={BASIS[rule.basis].status}>{BASIS[rule.basis].label}</StatusBadge>
        {!editing && (
          <Button variant="secondary" onClick={() => setEditing(true)} aria-label={`Change rule for ${ruleName(rule)}`}>
            Change
          </Button>
        )}
      </div>
      {learned && learned.events > 0 && <LearnedLife rule={rule} estimate={learned} />}
      {editing && <DueRuleForm rule={rule} onClose={() => setEditing(false)} />}
    </li>
  );
}

function DueRuleForm({ rule, onClose }: { rule: DueRuleDto; onClose: () => void }) {
  const update = useUpdateDueRule();
  const [draft, setDraft] = useState({
    inspectionIntervalMonths: rule.inspectionIntervalMonths?.toString() ?? '',
    replacementPolicy: rule.replacementPolicy,
    replacementAgeYears: rule.replacementAgeYears?.toString() ?? '',
    basis: rule.basis,
    source: rule.source,
  });
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const formRef = useFocusFirstError<HTMLFormElement>(errors);
  const num = (v: string) => (v.trim() === '' ? null : Number(v));

  async function submit(e: FormEvent) {
    e.preventDefault();
    setFailure(null);
    const parsed = dueRuleInput.safeParse({
      ...draft,
      inspectionIntervalMonths: num(draft.inspectionIntervalMonths),
      replacementAgeYears: draft.replacementPolicy === 'fixed_age' ? num(draft.replacementAgeYears) : null,
    });
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    try {
      await update.mutateAsync({ id: rule.id, body: parsed.data });
      onClose();
    } catch (err) {
      const { fields, message } = describeFailure(err);
      setErrors(fields);
      setFailure(message);
    }
  }

  const other = unclaimedErrors(errors, (k) => k in draft);
  const changedNumbers =
    draft.inspectionIntervalMonths !== (rule.inspectionIntervalMonths?.toString() ?? '') ||
    draft.replacementAgeYears !== (rule.replacementAgeYears?.toString() ?? '') ||
    draft.replacementPolicy !== rule.replacementPolicy;
  return (
    <form ref={formRef} onSubmit={submit} noValidate aria-label={`Rule for ${ruleName(rule)}`} className="mt-2 flex flex-col gap-3 rounded-plate border-2 border-plate-line bg-plate p-3">
      {(failure || other.length > 0) && (
        <Notice kind="danger" title="Rule not saved">
          {failure && <p>{failure}</p>}
          {other.map((m) => (
            <p key={m}>{m}</p>
          ))}
        </Notice>
      )}
      <div className="grid gap-3 md:grid-cols-3">
        <TextField
          label="Inspection interval (months)"
          inputMode="numeric"
          hint="Leave empty for no set interval."
          value={draft.inspectionIntervalMonths}
          onChange={(e) => setDraft({ ...draft, inspectionIntervalMonths: e.target.value })}
          error={errors.inspectionIntervalMonths}
        />
        <SelectField
          label="Replacement"
          value={draft.replacementPolicy}
          onChange={(e) => setDraft({ ...draft, replacementPolicy: e.target.value as ReplacementPolicy })}
          error={errors.replacementPolicy}
        >
          {REPLACEMENT_POLICIES.map((p) => (
            <option key={p} value={p}>
              {POLICY[p]}
            </option>
          ))}
        </SelectField>
        {draft.replacementPolicy === 'fixed_age' && (
          <TextField
            label="Replacement age (years)"
            inputMode="numeric"
            value={draft.replacementAgeYears}
            onChange={(e) => setDraft({ ...draft, replacementAgeYears: e.target.value })}
            error={errors.replacementAgeYears}
          />
        )}
      </div>
      <div className="grid gap-3 md:grid-cols-[1fr_2fr]">
        <SelectField
          label="Based on"
          value={draft.basis}
          onChange={(e) => setDraft({ ...draft, basis: e.target.value as DueRuleBasis })}
          error={errors.basis}
          hint={changedNumbers && draft.basis === 'published' ? 'Changed from the published figure? Then it is company policy.' : undefined}
        >
          {DUE_RULE_BASES.map((b) => (
            <option key={b} value={b}>
              {BASIS[b].label}
            </option>
          ))}
        </SelectField>
        <TextField label="Source" value={draft.source} onChange={(e) => setDraft({ ...draft, source: e.target.value })} error={errors.source} />
      </div>
      <FormActions saving={update.isPending} submitLabel="Save rule" onCancel={onClose} />
    </form>
  );
}
