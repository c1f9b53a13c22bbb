import { useParams } from 'react-router-dom';
import { LogoMark } from '@/components/ui/logo-mark';
import { Spinner } from '@/components/ui/page';
import { ApiError } from '@/lib/api-client';
import { useSharedRecord } from '../api/get-shared-record';
import { HomeownerRecord } from './homeowner-record';
import { RECORD_WORDS, SHARE_LINK_GONE_TITLES, type ShareLinkGoneCode } from '@shared/glossary';

/** Opened from a share link, without signing in. A withdrawn or expired link says which, and whom to ask for a new one; nothing more. */
export function SharePage() {
  const { token = '' } = useParams();
  const record = useSharedRecord(token);
  return (
    <div className="min-h-screen">
      <header className="bg-header text-header-text">
        <div className="mx-auto flex max-w-2xl items-center gap-2 px-3 py-2">
          <LogoMark />
          <span className="font-bold">Lifeplate</span>
          <span className="text-sm text-header-text/70">{`· your appliance’s ${RECORD_WORDS.lifeRecord}`}</span>
        </div>
      </header>
      {record.isPending ? (
        <Spinner label="Loading your record…" />
      ) : record.error ? (
        <main className="mx-auto max-w-2xl px-3 py-6">
          <LinkNotOpened error={record.error} />
        </main>
      ) : (
        <HomeownerRecord view={record.data} source={{ kind: 'share', token }} />
      )}
    </div>
  );
}

/** Why the link did not open: withdrawn by the company or expired (the server's words name the company to ask), else not a link we know. */
function LinkNotOpened({ error }: { error: Error }) {
  const gone = error instanceof ApiError && error.status === 410;
  const title = gone ? (SHARE_LINK_GONE_TITLES[error.code as ShareLinkGoneCode] ?? 'This link no longer opens') : 'This link does not work';
  return (
    <>
      <h1 className="text-xl font-bold">{title}</h1>
      <p className="mt-2">{gone ? error.message : 'Check that the whole link was copied, or ask your service company for a new one.'}</p>
    </>
  );
}
