import { z } from "zod";
import { roles } from "../access/roles";
import { emailSchema, passwordSchema, personNameSchema } from "../auth/schemas";
import { timeZoneSchema } from "../auth/time-zones";

export const roleSchema = z.enum(roles, { error: "Pick one of owner, producer, editor or crew." });

export const inviteSchema = z.strictObject({
  email: emailSchema,
  role: roleSchema,
});
export type InviteInput = z.infer<typeof inviteSchema>;

export const changeRoleSchema = z.strictObject({ role: roleSchema });

export const memberSchema = z.object({
  userId: z.string(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;

export const pendingInvitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: roleSchema,
  expiresAt: z.string(),
  invitedBy: z.string(),
});
export type PendingInvitation = z.infer<typeof pendingInvitationSchema>;

export const membersPageSchema = z.object({
  members: z.array(memberSchema),
  invitations: z.array(pendingInvitationSchema),
});
export type MembersPage = z.infer<typeof membersPageSchema>;

/** "closed": its addressee joined the channel through another invitation. */
export const invitationStates = ["open", "accepted", "expired", "revoked", "closed"] as const;

export const invitationPreviewSchema = z.object({
  channelName: z.string(),
  email: z.string(),
  role: roleSchema,
  invitedBy: z.string(),
  state: z.enum(invitationStates),
  hasAccount: z.boolean(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

/** Accepting as a newcomer creates the account; a signed-in person sends an empty body. */
export const acceptInvitationSchema = z.union([
  // A newcomer's account starts in the browser's zone (UTC when none is sent).
  z.strictObject({ name: personNameSchema, password: passwordSchema, timeZone: timeZoneSchema.optional() }),
  z.strictObject({}),
]);
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;
