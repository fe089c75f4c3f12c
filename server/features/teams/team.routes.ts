import { Router } from 'express';
import type { DataSource } from 'typeorm';
import {
  createTeamInputSchema, enterCarInputSchema, inviteMemberInputSchema, seasonQuerySchema, setFactorInputSchema, updateEntryInputSchema,
  updateMemberInputSchema, type CreateTeamInput, type EnterCarInput, type InviteMemberInput, type SeasonQuery, type SetFactorInput,
  type UpdateEntryInput, type UpdateMemberInput,
} from '@shared/collab/team.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import type { MailSettings } from '../../mail/mailer';
import {
  createTeam, enterCar, getTeam, inviteMember, listFactors, listMyTeams, removeMember, setFactor, updateEntry, updateMember, withdrawEntry,
} from './team.service';
import { classBoard } from './board.service';

type TeamParams = { teamId: string };
type MemberParams = TeamParams & { userId: string };
type EntryParams = TeamParams & { carId: string };

export function teamRoutes(ds: DataSource, mail?: MailSettings) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const teamParam = idParam('teamId');
  const memberParams = idParam('teamId', 'userId');
  const entryParams = idParam('teamId', 'carId');

  router.post('/', validate({ body: createTeamInputSchema }), async (req, res) => {
    res.status(201).json(await createTeam(ds, currentUser(req), parsed<CreateTeamInput>(res, 'body')));
  });

  router.get('/mine', async (req, res) => {
    res.json(list(await listMyTeams(ds, currentUser(req))));
  });

  router.get('/:teamId', validate({ params: teamParam }), async (req, res) => {
    res.json(await getTeam(ds, currentUser(req), parsed<TeamParams>(res, 'params').teamId));
  });

  router.post('/:teamId/invitations', validate({ params: teamParam, body: inviteMemberInputSchema }), async (req, res) => {
    const { teamId } = parsed<TeamParams>(res, 'params');
    res.status(201).json(await inviteMember(ds, mail, currentUser(req), teamId, parsed<InviteMemberInput>(res, 'body')));
  });

  router.patch('/:teamId/members/:userId', validate({ params: memberParams, body: updateMemberInputSchema }), async (req, res) => {
    const { teamId, userId } = parsed<MemberParams>(res, 'params');
    res.json(await updateMember(ds, currentUser(req), teamId, userId, parsed<UpdateMemberInput>(res, 'body').isCaptain));
  });

  router.delete('/:teamId/members/:userId', validate({ params: memberParams }), async (req, res) => {
    const { teamId, userId } = parsed<MemberParams>(res, 'params');
    await removeMember(ds, currentUser(req), teamId, userId);
    res.status(204).end();
  });

  router.post('/:teamId/entries', validate({ params: teamParam, body: enterCarInputSchema }), async (req, res) => {
    const { teamId } = parsed<TeamParams>(res, 'params');
    const { entry, created } = await enterCar(ds, currentUser(req), teamId, parsed<EnterCarInput>(res, 'body'));
    res.status(created ? 201 : 200).json(entry);
  });

  router.patch('/:teamId/entries/:carId', validate({ params: entryParams, body: updateEntryInputSchema }), async (req, res) => {
    const { teamId, carId } = parsed<EntryParams>(res, 'params');
    res.json(await updateEntry(ds, currentUser(req), teamId, carId, parsed<UpdateEntryInput>(res, 'body')));
  });

  router.delete('/:teamId/entries/:carId', validate({ params: entryParams }), async (req, res) => {
    const { teamId, carId } = parsed<EntryParams>(res, 'params');
    await withdrawEntry(ds, currentUser(req), teamId, carId);
    res.status(204).end();
  });

  router.get('/:teamId/factors', validate({ params: teamParam, query: seasonQuerySchema }), async (req, res) => {
    const { teamId } = parsed<TeamParams>(res, 'params');
    res.json(list(await listFactors(ds, currentUser(req), teamId, parsed<SeasonQuery>(res, 'query').season)));
  });

  router.put('/:teamId/factors', validate({ params: teamParam, body: setFactorInputSchema }), async (req, res) => {
    const { teamId } = parsed<TeamParams>(res, 'params');
    res.json(list(await setFactor(ds, currentUser(req), teamId, parsed<SetFactorInput>(res, 'body'))));
  });

  router.get('/:teamId/board', validate({ params: teamParam, query: seasonQuerySchema }), async (req, res) => {
    const { teamId } = parsed<TeamParams>(res, 'params');
    res.json(await classBoard(ds, currentUser(req), teamId, parsed<SeasonQuery>(res, 'query').season));
  });

  return router;
}
