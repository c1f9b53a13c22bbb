import { Link, useParams } from 'react-router-dom';
import { Page, Spinner } from '@/components/ui/page';
import { Card } from '@/components/ui/card';
import { useMyAppliance, useMyAppliances } from '../api/get-my-appliances';
import { HomeownerRecord } from './homeowner-record';
import { MoveRecordCard } from './move-record-card';

export function MyAppliancesPage() {
  const list = useMyAppliances();
  if (list.isPending) return <Spinner />;
  if (list.data?.length === 1) return <MyApplianceView id={list.data[0].id} />;
  return (
    <Page title="Your heating">
      <Card>
        {!list.data?.length && <p>No appliances are recorded for you yet.</p>}
        <ul className="flex flex-col gap-2">
          {list.data?.map((a) => (
            <li key={a.id}>
              <Link className="flex min-h-tap flex-col justify-center font-semibold underline" to={`/my/${a.id}`}>
                {a.title}
                <span className="text-sm font-normal">{a.address}</span>
              </Link>
            </li>
          ))}
        </ul>
      </Card>
    </Page>
  );
}

export function MyAppliancePage() {
  const { id = '' } = useParams();
  return <MyApplianceView id={id} />;
}

function MyApplianceView({ id }: { id: string }) {
  const view = useMyAppliance(id);
  if (view.isPending) return <Spinner />;
  if (view.error) return <Page title="Not found">{view.error.message}</Page>;
  return <HomeownerRecord view={view.data} source={{ kind: 'account', applianceId: id }} after={<MoveRecordCard applianceId={id} companyName={view.data.company.name} />} />;
}
