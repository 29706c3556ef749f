import { Router } from 'express';
import {
  acceptInvitationInputSchema,
  createGroupInputSchema,
  createInvitationInputSchema,
  updateMemberInputSchema,
} from '@/lib/schemas/groups';
import { getAuth, getMembership, isUuid, requireAuth, requireGroupRole } from '@/server/http/auth-middleware';
import { requestEm } from '@/server/db/request-context';
import { AppError } from '@/server/http/errors';
import { parseWith } from '@/server/http/validate';
import type { AccountsContext } from '@/server/modules/auth/auth-context';
import * as groups from './groups.service';

/** Path ids that are not UUIDs name nothing: 404, the same as an unknown id. */
function pathId(value: unknown, what: string): string {
  if (!isUuid(value)) throw new AppError('NOT_FOUND', `${what} was not found.`);
  return value;
}

export function groupRoutes(ctx: AccountsContext): Router {
  const router = Router();
  const em = requestEm;

  router.get('/groups', requireAuth, async (_req, res) => {
    res.json({ groups: await groups.listMyGroups(em(), getAuth(res).user.id) });
  });

  router.post('/groups', requireAuth, async (req, res) => {
    const { name } = parseWith(createGroupInputSchema, req.body);
    res.status(201).json(await groups.createGroup(em(), getAuth(res).user.id, name));
  });

  router.get('/groups/:groupId', requireGroupRole('viewer'), async (_req, res) => {
    const membership = getMembership(res);
    res.json(await groups.getGroupDetail(em(), membership.groupId, membership.role));
  });

  router.get('/groups/:groupId/invitations', requireGroupRole('admin'), async (_req, res) => {
    res.json({ invitations: await groups.listInvitations(em(), getMembership(res).groupId) });
  });

  router.post('/groups/:groupId/invitations', requireGroupRole('admin'), async (req, res) => {
    const input = parseWith(createInvitationInputSchema, req.body);
    const membership = getMembership(res);
    const invitation = await groups.createInvitation(ctx, em(), {
      groupId: membership.groupId,
      groupName: membership.groupName,
      inviterId: getAuth(res).user.id,
      ...input,
    });
    res.status(201).json(invitation);
  });

  router.delete('/groups/:groupId/invitations/:id', requireGroupRole('admin'), async (req, res) => {
    const id = pathId(req.params.id, 'That invitation');
    await groups.revokeInvitation(em(), getMembership(res).groupId, id, getAuth(res).user.id);
    res.status(204).end();
  });

  router.patch('/groups/:groupId/members/:userId', requireGroupRole('admin'), async (req, res) => {
    const userId = pathId(req.params.userId, 'That member');
    const { role } = parseWith(updateMemberInputSchema, req.body);
    const manager = em();
    const groupId = getMembership(res).groupId;
    await groups.changeRole(manager, groupId, getAuth(res).user.id, userId, role);
    res.json(await groups.getGroupDetail(manager, groupId, userId === getAuth(res).user.id ? role : getMembership(res).role));
  });

  /** Admins remove anyone; any member may remove themself (leave). */
  router.delete('/groups/:groupId/members/:userId', requireGroupRole('viewer'), async (req, res) => {
    const userId = pathId(req.params.userId, 'That member');
    const me = getAuth(res).user.id;
    if (userId !== me && getMembership(res).role !== 'admin') {
      throw new AppError('FORBIDDEN', 'Only an admin can remove other members.');
    }
    await groups.removeMember(em(), getMembership(res).groupId, me, userId);
    res.status(204).end();
  });

  router.get('/invitations/:token', async (req, res) => {
    const token = String(req.params.token);
    if (token.length < 16 || token.length > 128) throw new AppError('NOT_FOUND', 'This invitation is not valid.');
    res.setHeader('Cache-Control', 'no-store');
    res.json(await groups.previewInvitation(em(), token));
  });

  router.post('/invitations/accept', requireAuth, async (req, res) => {
    const { token } = parseWith(acceptInvitationInputSchema, req.body);
    const { user } = getAuth(res);
    res.json(await groups.acceptInvitation(em(), { id: user.id, email: user.email }, token));
  });

  return router;
}
