import { z } from "zod";
import { channelNameSchema } from "../../shared/auth/schemas";
import { acceptInvitationSchema, changeRoleSchema, inviteSchema, type MembersPage } from "../../shared/channels/schemas";
import { describeMe, startSession } from "../auth/auth.service";
import { AppError } from "../http/app-error";
import { callerOf, idOf, signedInUser } from "../http/guards";
import { anyAccount, channelAccess, publicAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import {
  changeMembershipKeepingAnOwner,
  insertChannelWithOwner,
  listMembers,
  listOpenInvitations,
  revokeInvitation,
} from "./channels.repository";
import { acceptInvitation, inviteMember, previewInvitation, type InvitationDeps } from "./invitations.service";
import type { ChannelStarters } from "../seams/channel-starters";

const newChannelSchema = z.strictObject({ name: channelNameSchema });

const lastOwner = () => new AppError("unprocessable", "A channel needs at least one owner. Make someone else owner first.");

export function channelRoutes(deps: InvitationDeps & ChannelStarters): RouteSpec[] {
  const { db } = deps;
  return [
    {
      method: "post",
      path: "/api/channels",
      access: anyAccount,
      handler: async (req, res) => {
        const { name } = parseBody(newChannelSchema, req.body);
        const channel = await insertChannelWithOwner(db, name, signedInUser(req).id, deps.channelStarters);
        res.status(201).json({ id: channel.id, name: channel.name });
      },
    },
    {
      method: "get",
      path: "/api/channels/:channelId/members",
      access: channelAccess("members", "R"),
      handler: async (req, res) => {
        const { channelId } = callerOf(req);
        const [members, invitations] = await Promise.all([listMembers(db, channelId), listOpenInvitations(db, channelId)]);
        const page: MembersPage = {
          members: members.map((m) => ({ ...m, joinedAt: m.joinedAt.toISOString() })),
          invitations: invitations.map((i) => ({ ...i, expiresAt: i.expiresAt.toISOString() })),
        };
        res.json(page);
      },
    },
    {
      method: "post",
      path: "/api/channels/:channelId/invitations",
      access: channelAccess("members", "W"),
      handler: async (req, res) => {
        const input = parseBody(inviteSchema, req.body);
        const sent = await inviteMember(deps, { ...input, channelId: callerOf(req).channelId, invitedBy: signedInUser(req) });
        res.status(201).json({ id: sent.id, email: input.email, role: input.role, expiresAt: sent.expiresAt.toISOString() });
      },
    },
    {
      method: "delete",
      path: "/api/channels/:channelId/invitations/:invitationId",
      access: channelAccess("members", "W"),
      handler: async (req, res) => {
        if (!(await revokeInvitation(db, callerOf(req).channelId, idOf(req, "invitationId")))) throw new AppError("not_found", "Invitation not found.");
        res.status(204).end();
      },
    },
    {
      method: "patch",
      path: "/api/channels/:channelId/members/:userId",
      access: channelAccess("members", "W"),
      handler: async (req, res) => {
        const userId = idOf(req, "userId");
        const { role } = parseBody(changeRoleSchema, req.body);
        const outcome = await changeMembershipKeepingAnOwner(db, callerOf(req).channelId, userId, { role });
        if (outcome === "missing") throw new AppError("not_found", "Member not found.");
        if (outcome === "last_owner") throw lastOwner();
        res.json({ userId, role });
      },
    },
    {
      method: "delete",
      path: "/api/channels/:channelId/members/:userId",
      access: channelAccess("members", "W"),
      handler: async (req, res) => {
        const userId = idOf(req, "userId");
        const outcome = await changeMembershipKeepingAnOwner(db, callerOf(req).channelId, userId, "remove");
        if (outcome === "missing") throw new AppError("not_found", "Member not found.");
        if (outcome === "last_owner") throw lastOwner();
        res.status(204).end();
      },
    },
    {
      method: "get",
      path: "/api/invitations/:token",
      access: publicAccess,
      handler: async (req, res) => res.json(await previewInvitation(db, String(req.params.token))),
    },
    {
      method: "post",
      path: "/api/invitations/:token/accept",
      access: publicAccess,
      handler: async (req, res) => {
        const input = parseBody(acceptInvitationSchema, req.body);
        const accepted = await acceptInvitation(db, String(req.params.token), input, req.user);
        if (accepted.newAccount) await startSession(req, accepted.user);
        res.json({ channelId: accepted.channelId, me: await describeMe(db, req) });
      },
    },
  ];
}
