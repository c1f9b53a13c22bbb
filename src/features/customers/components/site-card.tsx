import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { ApplianceSummary, CustomerDetailDto } from '@shared/schemas/records';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { useUpdateSite } from '../api/update-site';
import { ApplianceStatusBadge, applianceLabel } from './appliance-labels';
import { MarkReplacedForm } from './mark-replaced-form';
import { SiteForm } from './site-form';

type Site = CustomerDetailDto['sites'][number];

export function SiteCard({ site, allAppliances, canWrite }: { site: Site; allAppliances: ApplianceSummary[]; canWrite: boolean }) {
  const [editing, setEditing] = useState(false);
  const update = useUpdateSite();
  const address = `${site.street}, ${site.town}${site.postalCode ? ` ${site.postalCode}` : ''}`;

  if (editing) {
    return (
      <Card title={`Edit site: ${site.street}`}>
        <SiteForm
          customerId={site.customerId}
          initial={site}
          submitLabel="Save site"
          onCancel={() => setEditing(false)}
          onSubmit={async ({ customerId: _customerId, ...body }) => {
            await update.mutateAsync({ id: site.id, body });
            setEditing(false);
          }}
        />
      </Card>
    );
  }

  return (
    <Card
      title={address}
      action={
        canWrite && (
          <Button variant="ghost" onClick={() => setEditing(true)} aria-label={`Edit site ${site.street}`}>
            Edit site
          </Button>
        )
      }
    >
      <dl className="mb-3 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="font-semibold">Access</dt>
        <dd className="whitespace-pre-line">{site.accessNotes ?? 'No notes'}</dd>
        <dt className="font-semibold">Elevation</dt>
        <dd>{site.elevationFt === null ? 'Not recorded' : `${site.elevationFt.toLocaleString('en-US')} ft`}</dd>
        <dt className="font-semibold">Technician</dt>
        <dd>{site.assignedTechnicianName ?? 'Nobody in particular'}</dd>
      </dl>
      <h3 className="mb-1 font-semibold">Appliances</h3>
      {site.appliances.length === 0 ? (
        <p className="text-iron-muted">No appliance recorded at this site yet.</p>
      ) : (
        <ul className="divide-y divide-plate-line">
          {site.appliances.map((a) => (
            <ApplianceItem key={a.id} appliance={a} allAppliances={allAppliances} canWrite={canWrite} />
          ))}
        </ul>
      )}
      {canWrite && (
        <Link
          to={`/appliances/new?siteId=${site.id}&customerId=${site.customerId}`}
          className="mt-3 inline-flex min-h-tap items-center rounded-plate border border-plate-line bg-plate-deep px-4 font-semibold hover:bg-brass-light"
        >
          + Add appliance
        </Link>
      )}
    </Card>
  );
}

function ApplianceItem({ appliance: a, allAppliances, canWrite }: { appliance: ApplianceSummary; allAppliances: ApplianceSummary[]; canWrite: boolean }) {
  const [replacing, setReplacing] = useState(false);
  const candidates = allAppliances.filter((c) => c.id !== a.id && c.status !== 'removed');
  return (
    <li className="py-2">
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <Link to={`/appliances/${a.id}`} className="flex min-h-tap items-center font-semibold underline underline-offset-2">
          {applianceLabel(a)}
        </Link>
        <ApplianceStatusBadge status={a.status} />
        {canWrite && a.status !== 'removed' && !replacing && (
          <Button variant="ghost" className="ml-auto" onClick={() => setReplacing(true)}>
            Mark replaced
          </Button>
        )}
      </div>
      <p className="text-sm text-iron-muted">
        {a.status === 'removed' && 'Replaced; its life record is kept. '}
        {[a.serial && `Serial ${a.serial}`, a.location, a.installedOn && `Installed ${a.installedOn}`].filter(Boolean).join(' · ') || 'No serial or location recorded'}
      </p>
      {replacing && <MarkReplacedForm appliance={a} candidates={candidates} onDone={() => setReplacing(false)} />}
    </li>
  );
}
