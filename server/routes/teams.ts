import { Router } from "express";
import { invitationRequest as invitationBody, roleRequest as roleBody, teamChangesRequest as teamChanges, teamRequest as teamBody } from "../../shared/api/teams.js";
import { signedInUser } from "../auth/session.js";
import type { Services } from "../domain/services.js";
import {
  acceptInvitation,
  changeMemberRole,
  createTeam,
  deleteTeam,
  invitationPreview,
  inviteMember,
  pendingInvitations,
  removeMember,
  revokeInvitation,
  teamDetail,
  updateTeam,
} from "../domain/teams.js";
import { notFound } from "../domain/errors.js";
import { idParam, parseBody, tokenParam } from "../lib/validate.js";

// A member id is a user id: lucia's base32 ids or the seed's readable ones.
function userIdParam(value: unknown): string {
  if (typeof value !== "string" || !/^[a-z0-9-]{1,64}$/.test(value)) throw notFound("That member");
  return value;
}

export function teamsRouter(services: Services): Router {
  const router = Router();
  const { db } = services;

  router.post("/teams", async (req, res) => {
    const user = signedInUser(res);
    const { name } = parseBody(teamBody, req.body);
    res.status(201).json(await createTeam(db, user.id, name));
  });

  router.get("/teams/:teamId", async (req, res) => {
    const user = signedInUser(res);
    const { members: _members, ...team } = await teamDetail(db, user.id, idParam(req.params.teamId, "That team"));
    res.json(team);
  });

  router.patch("/teams/:teamId", async (req, res) => {
    const user = signedInUser(res);
    const teamId = idParam(req.params.teamId, "That team");
    const changes = parseBody(teamChanges, req.body);
    const { members: _members, ...team } = await updateTeam(db, user.id, teamId, changes);
    res.json(team);
  });

  router.delete("/teams/:teamId", async (req, res) => {
    const user = signedInUser(res);
    await deleteTeam(db, user.id, idParam(req.params.teamId, "That team"));
    res.status(204).end();
  });

  router.get("/teams/:teamId/members", async (req, res) => {
    const user = signedInUser(res);
    const { members } = await teamDetail(db, user.id, idParam(req.params.teamId, "That team"));
    res.json({ members });
  });

  router.patch("/teams/:teamId/members/:userId", async (req, res) => {
    const user = signedInUser(res);
    const teamId = idParam(req.params.teamId, "That team");
    const { role } = parseBody(roleBody, req.body);
    const { members } = await changeMemberRole(db, user.id, teamId, userIdParam(req.params.userId), role);
    res.json({ members });
  });

  router.delete("/teams/:teamId/members/:userId", async (req, res) => {
    const user = signedInUser(res);
    await removeMember(db, user.id, idParam(req.params.teamId, "That team"), userIdParam(req.params.userId));
    res.status(204).end();
  });

  router.post("/teams/:teamId/invitations", async (req, res) => {
    const user = signedInUser(res);
    const teamId = idParam(req.params.teamId, "That team");
    const { email, role } = parseBody(invitationBody, req.body);
    res.status(201).json(await inviteMember(services, user, teamId, email, role));
  });

  router.get("/teams/:teamId/invitations", async (req, res) => {
    const user = signedInUser(res);
    res.json({ invitations: await pendingInvitations(db, user.id, idParam(req.params.teamId, "That team")) });
  });

  router.delete("/teams/:teamId/invitations/:invitationId", async (req, res) => {
    const user = signedInUser(res);
    const teamId = idParam(req.params.teamId, "That team");
    await revokeInvitation(db, user.id, teamId, idParam(req.params.invitationId, "That invitation"));
    res.status(204).end();
  });

  // The invitation link itself: readable without an account, accepted once signed in.
  router.get("/invitations/:token", async (req, res) => {
    res.json(await invitationPreview(db, tokenParam(req.params.token, "That invitation")));
  });

  router.post("/invitations/:token/accept", async (req, res) => {
    const user = signedInUser(res);
    res.json({ team: await acceptInvitation(db, user, tokenParam(req.params.token, "That invitation")) });
  });

  return router;
}
