import { z } from "zod";
import { roles } from "../access/roles";
import { oneLine } from "../fields/text";
import { timeZoneSchema } from "./time-zones";

export const emailSchema = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .toLowerCase()
  .max(254, "That address is too long.")
  .pipe(z.email({ error: "Enter a valid e-mail address." }));

export const passwordSchema = z
  .string({ error: "Enter a password." })
  .min(10, "Use at least 10 characters.")
  .max(200, "Use at most 200 characters.");

export const personNameSchema = oneLine(80, { blank: "Enter your name.", tooLong: "Keep the name under 80 characters." });

export const channelNameSchema = oneLine(80, { blank: "Name the channel.", tooLong: "Keep the channel name under 80 characters." }).min(
  2,
  "Name the channel (at least 2 characters).",
);

export const signInSchema = z.strictObject({
  email: emailSchema,
  password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const signUpSchema = z.strictObject({
  name: personNameSchema,
  email: emailSchema,
  password: passwordSchema,
  channelName: channelNameSchema,
  /** The browser's zone, which the new account starts with (UTC when none is sent); changed on the account page. */
  timeZone: timeZoneSchema.optional(),
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const membershipSchema = z.object({
  channelId: z.string(),
  channelName: z.string(),
  role: z.enum(roles),
});
export type Membership = z.infer<typeof membershipSchema>;

export const userSchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  timeZone: z.string(),
  /** The person opened the link mailed to their address; until then they can't invite or send review links. */
  emailVerified: z.boolean(),
});
export type User = z.infer<typeof userSchema>;

export const meSchema = z.object({
  user: userSchema.nullable(),
  memberships: z.array(membershipSchema),
  csrfToken: z.string(),
});
export type Me = z.infer<typeof meSchema>;

/** The token of an address-confirmation link (/verify/<token>). */
export const verifyEmailSchema = z.strictObject({
  token: z.string({ error: "The link has no token." }).regex(/^[A-Za-z0-9_-]{43}$/, "This confirmation link is not valid."),
});
export type VerifyEmailInput = z.infer<typeof verifyEmailSchema>;

export interface VerifyEmailAnswer {
  confirmed: string;
  me: Me;
}

export interface VerificationMailAnswer {
  /** The address the new link goes to; null when the address is already confirmed (nothing sent). */
  sentTo: string | null;
}
