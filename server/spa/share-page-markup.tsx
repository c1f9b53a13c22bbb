import { QueryClientProvider } from '@tanstack/react-query';
import { renderToString } from 'react-dom/server';
import { Route, Routes, StaticRouter } from 'react-router-dom';
import type { Logger } from 'pino';
import { SharePage } from '../../src/features/homeowner/components/share-page';
import { createQueryClient } from '../../src/lib/query-client';
import type { HomeownerViewDto } from '../../shared/schemas/homeowner';
import { preloadKeys } from './preload';

/**
 * The share page's first screen as HTML, rendered from the client's own components with the view the page also
 * embeds as data, so it paints before any script has arrived. The client replaces it with identical markup.
 * A render failure is logged and the page is served as before (an empty root the client fills).
 */
export function sharePageMarkup(token: string, view: HomeownerViewDto, logger: Pick<Logger, 'warn'>): string {
  const queryClient = createQueryClient();
  try {
    queryClient.setQueryData(preloadKeys.share(token), view);
    return renderToString(
      <QueryClientProvider client={queryClient}>
        <StaticRouter location={`/s/${encodeURIComponent(token)}`}>
          <Routes>
            <Route path="/s/:token" element={<SharePage />} />
          </Routes>
        </StaticRouter>
      </QueryClientProvider>,
    );
  } catch (err) {
    logger.warn({ err }, 'share page first screen not rendered on the server');
    return '';
  } finally {
    queryClient.clear();
  }
}
