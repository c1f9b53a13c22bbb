import { Link } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { Page } from '@/components/ui/page';
import { formatTagCode } from '@shared/tags/tag-code';
import { RECORD_WORDS } from '@shared/glossary';

const telHref = (phone: string) => `tel:${phone.replace(/[^\d+]/g, '')}`;

/** What anyone who scans a tag may see: whose tag it is and how to call them. Nothing about the home or its owner. */
export function PublicTagInfo({
  code,
  companyName,
  companyPhone,
  viewer,
}: {
  code: string;
  companyName: string;
  companyPhone: string | null;
  viewer: { kind: 'signed-out' } | { kind: 'other-company'; ownCompany: string | null } | { kind: 'homeowner' };
}) {
  return (
    <Page title="Heating appliance tag" subtitle={`Tag ${formatTagCode(code)}`}>
      {viewer.kind === 'other-company' && (
        <Notice kind="caution" title="This tag belongs to another company">
          {viewer.ownCompany ? `${viewer.ownCompany} does not keep this appliance's record. ` : ''}Its record stays with the company below.
        </Notice>
      )}
      <p className="text-lg">
        This appliance&apos;s {RECORD_WORDS.lifeRecord} is kept by <strong>{companyName}</strong>.
      </p>
      {companyPhone && (
        <a
          href={telHref(companyPhone)}
          className="inline-flex min-h-14 w-full items-center justify-center rounded-plate bg-iron px-4 text-xl font-semibold text-plate hover:bg-iron-soft sm:w-auto"
        >
          Call {companyPhone}
        </a>
      )}
      {viewer.kind === 'signed-out' && (
        <div className="flex flex-col gap-2">
          <p className="text-iron-muted">Work there, or have a homeowner account with them? Sign in to open the record.</p>
          <Link
            to={`/sign-in?next=${encodeURIComponent(`/t/${code}`)}`}
            className="inline-flex min-h-tap w-full items-center justify-center rounded-plate border border-plate-line bg-plate-deep px-4 text-base font-semibold text-iron hover:bg-brass-light sm:w-auto"
          >
            Sign in
          </Link>
        </div>
      )}
      {viewer.kind !== 'signed-out' && (
        <Link to="/" className="inline-flex min-h-tap items-center font-semibold underline">
          Back to Lifeplate
        </Link>
      )}
      <Notice kind="caution" title="If you smell gas">
        Leave the building without switching anything on or off, and call the gas supplier&apos;s emergency number from outside.
      </Notice>
    </Page>
  );
}
