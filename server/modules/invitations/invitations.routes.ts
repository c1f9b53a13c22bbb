import { Router, type Response } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { acceptInvitationInput, homeownerInvitationInput, memberInvitationInput } from '../../../shared/schemas/invitations';
import { invitationsService } from './invitations.service';
import { acceptanceService } from './acceptance.service';

const signedIn = (res: Response) => {
  const s = res.locals.session!;
  return { userId: s.userId, email: s.email };
};

export function invitationRoutes(ctx: AppContext) {
  const router = Router();
  const office = invitationsService(ctx);
  const invitee = acceptanceService(ctx);

  defineRoute(
    router,
    'post',
    '/team/invitations',
    { access: { permission: 'team:manage' }, schemas: { body: memberInvitationInput }, status: 201 },
    ({ body }, _req, res) => office.inviteMember(currentMember(res), body),
  );
  defineRoute(router, 'get', '/team/invitations', { access: { permission: 'team:manage' } }, (_i, _req, res) => office.listPending(currentMember(res)));
  defineRoute(
    router,
    'post',
    '/team/invitations/:id/revoke',
    { access: { permission: 'team:manage' }, schemas: { params: uuidParam } },
    ({ params }, _req, res) => office.revoke(currentMember(res), params.id),
  );
  defineRoute(
    router,
    'post',
    '/team/invitations/:id/resend',
    { access: { permission: 'team:manage' }, schemas: { params: uuidParam } },
    ({ params }, _req, res) => office.resend(currentMember(res), params.id),
  );
  // share:create: like a share link, this gives someone outside the company a view of the customer's records.
  defineRoute(
    router,
    'post',
    '/customers/:id/homeowner-invitation',
    { access: { permission: 'share:create' }, schemas: { params: uuidParam, body: homeownerInvitationInput }, status: 201 },
    ({ params, body }, _req, res) => office.inviteHomeowner(currentMember(res), params.id, body),
  );

  defineRoute(router, 'get', '/invitations/:id', { access: 'signed-in', schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    invitee.get(signedIn(res), params.id),
  );
  defineRoute(
    router,
    'post',
    '/invitations/:id/accept',
    { access: 'signed-in', schemas: { params: uuidParam, body: acceptInvitationInput } },
    ({ params, body }, _req, res) => invitee.accept(signedIn(res), params.id, body),
  );
  return router;
}
