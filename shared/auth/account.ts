import { z } from "zod";
import { versionSchema } from "../http/version";
import { emailSchema, passwordSchema, personNameSchema } from "./schemas";
import { timeZoneSchema } from "./time-zones";

export { canonicalTimeZone, knownTimeZones, timeZoneSchema } from "./time-zones";

/**
 * Mail a person may turn off. Mail about their own account (a new password, confirming an address)
 * has no topic: it is always sent. Invitations and review links go to addresses, not accounts.
 */
export const mailTopics = ["mentions", "reminders", "decisions"] as const;
export type MailTopic = (typeof mailTopics)[number];

export const mailTopicLabels: Record<MailTopic, { label: string; hint: string }> = {
  mentions: { label: "Mentions", hint: "Someone names you in a comment on an episode." },
  reminders: { label: "Due-date reminders", hint: "A sponsor item you own is due soon or late." },
  decisions: { label: "Sponsor answers", hint: "A sponsor approved or asked for changes through a review link you sent." },
};

/** The account as its settings page shows it. */
export interface AccountSettings {
  id: string;
  name: string;
  email: string;
  emailVerified: boolean;
  timeZone: string;
  mailOptOuts: MailTopic[];
  /** A new address waiting for its link to be opened; the account keeps `email` until then. */
  pendingEmail: string | null;
  version: number;
}

export const profileSchema = z.strictObject({
  version: versionSchema,
  name: personNameSchema,
  timeZone: timeZoneSchema,
  mailOptOuts: z.array(z.enum(mailTopics, { error: "Unknown mail topic." })).max(mailTopics.length),
});
export type ProfileInput = z.infer<typeof profileSchema>;

const currentPasswordSchema = z.string({ error: "Enter your current password." }).min(1, "Enter your current password.").max(200);

export const emailChangeSchema = z.strictObject({
  email: emailSchema,
  currentPassword: currentPasswordSchema,
});
export type EmailChangeInput = z.infer<typeof emailChangeSchema>;

export interface EmailChangeAnswer {
  pendingEmail: string;
}

export const passwordChangeSchema = z.strictObject({
  currentPassword: currentPasswordSchema,
  newPassword: passwordSchema,
});
export type PasswordChangeInput = z.infer<typeof passwordChangeSchema>;

export interface SignedOutAnswer {
  /** How many other sessions were ended. */
  signedOut: number;
}

/** One place the account is signed in. */
export interface AccountSession {
  /** A handle for the list (not the session's secret id). */
  key: string;
  startedAt: string | null;
  lastSeenAt: string;
  /** Browser and system, read from what the browser said when it signed in. */
  device: string;
  current: boolean;
}

export interface AccountSessions {
  sessions: AccountSession[];
}

/** "Forgot password": the same answer whether or not the address has an account. */
export const passwordResetRequestSchema = z.strictObject({ email: emailSchema });
export type PasswordResetRequest = z.infer<typeof passwordResetRequestSchema>;

export const PASSWORD_RESET_ANSWER = "If that address has a Kerf account, a link to set a new password is on its way. It works once, within an hour.";

export interface PasswordResetRequestAnswer {
  message: string;
}

export const passwordResetSchema = z.strictObject({
  token: z.string({ error: "The link has no token." }).regex(/^[A-Za-z0-9_-]{43}$/, "This link is not valid."),
  password: passwordSchema,
});
export type PasswordResetInput = z.infer<typeof passwordResetSchema>;
