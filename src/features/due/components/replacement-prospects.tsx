import { Link } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { Spinner } from '@/components/ui/page';
import { StatusBadge } from '@/components/ui/status-badge';
import { LABELS } from '@shared/schemas/enums';
import { formatCalendarDate } from '@shared/format/dates';
import { useReplacementProspects } from '../api/get-replacement-prospects';

/** Appliances near or past their published median life: candidates to talk to the owner about replacing. */
export function ReplacementProspects() {
  const prospects = useReplacementProspects();
  if (prospects.isPending) return <Spinner />;
  if (!prospects.data) return null;
  return (
    <Card title={`Replacement prospects (${prospects.data.length})`}>
      <p className="mb-2 text-sm text-iron-muted">
        Median service lives from the ASHRAE equipment service-life table (1978 survey data). They are medians, not predictions: half of all equipment
        outlives them.
      </p>
      {!prospects.data.length ? (
        <p>No appliance is within two years of its median life.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="tabular w-full text-left text-sm">
            <thead>
              <tr className="border-b-2 border-plate-line whitespace-nowrap">
                <th className="py-2 pr-3">Age</th>
                <th className="pr-3">Appliance</th>
                <th className="pr-3">Customer</th>
                <th className="pr-3">Last combustion test</th>
              </tr>
            </thead>
            <tbody>
              {prospects.data.map((p) => (
                <tr key={p.applianceId} className="border-b border-plate-line whitespace-nowrap">
                  <td className="py-1 pr-3">
                    {p.ageYears} of {p.medianYears} years{' '}
                    {p.status === 'past' ? <StatusBadge status="due">Past median</StatusBadge> : <StatusBadge status="soon">Near median</StatusBadge>}
                  </td>
                  <td className="max-w-[24rem] truncate pr-3" title={`${p.makeAndModel ? `${p.makeAndModel}, ` : ''}${p.street}, ${p.town}`}>
                    <Link className="inline-flex min-h-tap items-center font-semibold text-brass-dark underline lg:min-h-6" to={`/appliances/${p.applianceId}`}>
                      {LABELS.applianceKind[p.kind]}, {LABELS.fuel[p.fuel].toLowerCase()}
                    </Link>
                    <span className="text-iron-muted">
                      {' '}
                      · {p.makeAndModel ? `${p.makeAndModel} · ` : ''}
                      {p.street}, {p.town}
                    </span>
                  </td>
                  <td className="pr-3">{p.customerName}</td>
                  <td className="pr-3">
                    {p.lastCombustion
                      ? `${formatCalendarDate(p.lastCombustion.on)}: ${p.lastCombustion.efficiencyPct == null ? '—' : `${p.lastCombustion.efficiencyPct.toFixed(1)} % eff.`}, CO ${p.lastCombustion.coAirFreePpm == null ? '—' : Math.round(p.lastCombustion.coAirFreePpm)} ppm air-free`
                      : 'None recorded'}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Card>
  );
}
