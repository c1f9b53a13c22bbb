import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { bookingReplyInput, bookingReplyTokenParam } from '../../../shared/schemas/booking-notices';
import { bookingReplyService } from './booking-reply.service';

export function bookingReplyRoutes(ctx: AppContext) {
  const router = Router();
  const service = bookingReplyService(ctx);
  // A capability page, like the share page: never indexed, never cached by anyone but the holder's browser.
  defineRoute(router, 'get', '/booking-reply/:token', { access: 'public', schemas: { params: bookingReplyTokenParam } }, ({ params }, _req, res) => {
    res.setHeader('X-Robots-Tag', 'noindex, nofollow');
    res.setHeader('Cache-Control', 'private, no-store');
    return service.open(params.token);
  });
  defineRoute(
    router,
    'post',
    '/booking-reply/:token',
    { access: 'public', schemas: { params: bookingReplyTokenParam, body: bookingReplyInput }, status: 201 },
    ({ params, body }) => service.reply(params.token, body),
  );
  return router;
}
