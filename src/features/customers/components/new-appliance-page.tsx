import { useMemo, useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { LABELS } from '@shared/schemas/enums';
import { Page } from '@/components/ui/page';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import type { FieldErrors } from '@/lib/api-client';
import { useComponentTypes } from '@/lib/resources/component-types';
import { useCustomer } from '../api/get-customer';
import { useCreateAppliance } from '../api/create-appliance';
import { buildApplianceBody, emptyApplianceDraft, isOil, newComponentDraft, type ApplianceDraft, type ComponentDraft } from './appliance-draft';
import { APPLIANCE_FIELD_KEYS, ApplianceFieldsSection } from './appliance-fields-section';
import { ComponentsSection } from './components-section';
import { describeFailure, unclaimedErrors } from '@/lib/form-errors';
import { starterComponents } from './starter-components';
import { useFocusFirstError } from '@/lib/use-focus-first-error';

/** One form for the appliance and its parts; posted in one request so the record is never half made. */
export function NewAppliancePage() {
  const [params] = useSearchParams();
  const siteId = params.get('siteId') ?? '';
  const customerId = params.get('customerId') ?? undefined;
  const customer = useCustomer(customerId);
  const site = customer.data?.sites.find((s) => s.id === siteId);
  const catalog = useComponentTypes();
  const create = useCreateAppliance();
  const navigate = useNavigate();

  const [draft, setDraft] = useState<ApplianceDraft>(emptyApplianceDraft);
  const [rows, setRowsState] = useState<ComponentDraft[]>([]);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const formRef = useFocusFirstError<HTMLFormElement>(errors);

  const activeCatalog = useMemo(() => (catalog.data ?? []).filter((c) => c.active), [catalog.data]);
  const starterFor = (d: ApplianceDraft) =>
    starterComponents(d.kind, d.fuel, d.ignitionType).filter((code) => activeCatalog.some((c) => c.code === code));

  function changeField<K extends keyof ApplianceDraft>(key: K, value: ApplianceDraft[K]) {
    const next = { ...draft, [key]: value };
    // Oil burners light from their own ignition; saves a pick that has only one sensible answer.
    if (key === 'fuel' && value === 'oil_no2' && !draft.ignitionType) next.ignitionType = 'oil_burner';
    setDraft(next);
    // While the list holds only untouched suggestions, follow the new kind/fuel/ignition with a fresh starter set.
    if ((key === 'kind' || key === 'fuel' || key === 'ignitionType') && rows.every((r) => r.untouchedSuggestion)) {
      setRowsState(starterFor(next).map((code) => newComponentDraft(code, true)));
    }
  }

  function setRows(update: (rows: ComponentDraft[]) => ComponentDraft[]) {
    setRowsState((current) => {
      const next = update(current);
      // Rows shifted, so errors keyed by row number would point at the wrong part.
      if (next.length !== current.length) setErrors((e) => Object.fromEntries(Object.entries(e).filter(([k]) => !k.startsWith('components'))));
      return next;
    });
  }

  const missingSuggestions = starterFor(draft)
    .filter((code) => !rows.some((r) => r.typeCode === code))
    .map((code) => activeCatalog.find((c) => c.code === code)!);
  const suggestionFor = draft.kind && draft.fuel
    ? `a ${LABELS.applianceKind[draft.kind].toLowerCase()} on ${LABELS.fuel[draft.fuel].toLowerCase()}${draft.ignitionType && !isOil(draft) ? ` with ${LABELS.ignitionType[draft.ignitionType].toLowerCase()} ignition` : ''}`
    : null;

  async function submit(e: FormEvent) {
    e.preventDefault();
    setFailure(null);
    const built = buildApplianceBody(siteId, draft, rows, catalog.data ?? []);
    if (!built.ok) {
      setErrors(built.errors);
      setFailure('Some fields need a look; they are marked below. Nothing you typed is lost.');
      return;
    }
    setErrors({});
    try {
      const record = await create.mutateAsync(built.body);
      navigate(`/appliances/${record.appliance.id}`);
    } catch (err) {
      const { fields, message } = describeFailure(err);
      setErrors(fields);
      setFailure(message);
    }
  }

  const hiddenRating = isOil(draft) ? 'inputBtuh' : 'firingRateGph';
  const other = unclaimedErrors(
    errors,
    (k) => (APPLIANCE_FIELD_KEYS.includes(k) && k !== hiddenRating && k !== 'siteId') || k.startsWith('components'),
  );
  const back = customerId ? `/customers/${customerId}` : '/customers';

  if (!siteId) {
    return (
      <Page title="New appliance">
        <Notice kind="caution" title="Pick a site first">
          An appliance belongs to a site. Open the customer and use &ldquo;Add appliance&rdquo; on the right site.
        </Notice>
        <Link to="/customers" className="font-semibold underline">
          Go to customers
        </Link>
      </Page>
    );
  }

  return (
    <Page
      title="New appliance"
      subtitle={site && customer.data ? `${customer.data.name} · ${site.street}, ${site.town}` : undefined}
      actions={
        <Link to={back} className="flex min-h-tap items-center font-semibold underline">
          Back to the customer
        </Link>
      }
    >
      <form ref={formRef} onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="New appliance">
        {(failure || other.length > 0) && (
          <Notice kind="danger" title="Not saved yet">
            {failure && <p>{failure}</p>}
            {other.map((m) => (
              <p key={m}>{m}</p>
            ))}
          </Notice>
        )}
        <ApplianceFieldsSection draft={draft} errors={errors} onChange={changeField} />
        <ComponentsSection
          rows={rows}
          setRows={setRows}
          catalog={activeCatalog}
          catalogError={catalog.isError ? catalog.error.message : null}
          suggestions={missingSuggestions}
          suggestionFor={suggestionFor}
          errors={errors}
          steamOrHotWater={draft.kind === 'steam_boiler' || draft.kind === 'hot_water_boiler'}
        />
        <div className="flex flex-wrap gap-2">
          <Button type="submit" disabled={create.isPending}>
            {create.isPending ? 'Saving…' : 'Save appliance and parts'}
          </Button>
          <Link to={back} className="inline-flex min-h-tap items-center rounded-plate border border-plate-line bg-plate-deep px-4 font-semibold">
            Cancel
          </Link>
        </div>
      </form>
    </Page>
  );
}
