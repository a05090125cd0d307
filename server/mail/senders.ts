import { AppError } from "../http/app-error";

/**
 * Kerf mails other people (invitations, review links) only for an account whose own address is
 * confirmed: otherwise anyone could sign up with a throwaway address and use Kerf's name to mail strangers.
 */
export function requireConfirmedAddress(user: { email: string; emailVerified: boolean }): void {
  if (user.emailVerified) return;
  throw new AppError(
    "forbidden",
    `Confirm your e-mail address first: open the link Kerf mailed to ${user.email} (or send it again from the notice at the top of the page). Until then Kerf sends nothing to other people for you.`,
  );
}
