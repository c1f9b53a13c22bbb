import { useParams } from 'react-router-dom';
import { LogoMark } from '@/components/ui/logo-mark';
import { Spinner } from '@/components/ui/page';
import { ApiError } from '@/lib/api-client';
import { useSharedRecord } from '../api/get-shared-record';
import { HomeownerRecord } from './homeowner-record';
import { RECORD_WORDS } from '@shared/glossary';

/** Opened from a share link, without signing in. An expired or revoked link says so and nothing more. */
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
          <h1 className="text-xl font-bold">{record.error instanceof ApiError && record.error.status === 410 ? 'This link has expired' : 'This link does not work'}</h1>
          <p className="mt-2">
            {record.error instanceof ApiError && record.error.status === 410
              ? 'This link has expired: ask your service company for a new one.'
              : 'Check that the whole link was copied, or ask your service company for a new one.'}
          </p>
        </main>
      ) : (
        <HomeownerRecord view={record.data} source={{ kind: 'share', token }} />
      )}
    </div>
  );
}
