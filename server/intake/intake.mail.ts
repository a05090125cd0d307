import { and, eq } from "drizzle-orm";
import type { Database } from "../db/client";
import { intakeIdeas, intakeNews } from "../db/schema/intake";
import { mailKind, type MailRenderers } from "../mail/mail-jobs";
import { newLinkToken } from "../mail/link-tokens";
import type { NewsTokens } from "./news-token";
import { contactToMail, setConfirmHash } from "./page.repository";

/** "Is this your address?": the only mail an address gets before it is confirmed. */
export const confirmMail = mailKind<{ contactId: string }>("intake-confirm");
/** "The video you asked for is out": once per viewer per episode (intake_news). */
export const newsMail = mailKind<{ contactId: string; episodeId: string }>("intake-news");

export interface IntakeMailDeps {
  db: Database;
  appUrl: string;
  tokens: NewsTokens;
}

export function intakeMailRenderers(deps: IntakeMailDeps): MailRenderers {
  return {
    ...confirmMail.renderer(async ({ contactId }) => {
      const contact = await contactToMail(deps.db, contactId);
      if (!contact || contact.confirmedAt) return { skip: "the address is confirmed already or gone" };
      if (contact.unsubscribedAt) return { skip: "the address asked for no more mail" };
      const { token, hash } = newLinkToken();
      if (!(await setConfirmHash(deps.db, contactId, hash))) return { skip: "the address is confirmed already" };
      return {
        send: {
          to: contact.email,
          subject: `Confirm your address for ${contact.channelName}`,
          text: [
            `You sent ${contact.channelName} a suggestion and asked to hear when a video comes of it.`,
            "",
            "Open this link to confirm the address (until you do, nothing else is sent to it):",
            `${deps.appUrl}/suggest/confirm/${token}`,
            "",
            "If it wasn't you, ignore this mail: nothing more will come.",
          ].join("\n"),
        },
      };
    }),
    ...newsMail.renderer(async ({ contactId, episodeId }) => {
      const contact = await contactToMail(deps.db, contactId);
      if (!contact?.confirmedAt) return { skip: "the address was never confirmed" };
      if (contact.unsubscribedAt) return { skip: "the address asked for no more mail" };
      const [news] = await deps.db
        .select({ videoUrl: intakeNews.videoUrl, wording: intakeIdeas.wording })
        .from(intakeNews)
        .leftJoin(intakeIdeas, eq(intakeIdeas.episodeId, intakeNews.episodeId))
        .where(and(eq(intakeNews.episodeId, episodeId), eq(intakeNews.contactId, contactId)))
        .limit(1);
      if (!news) return { skip: "the episode is gone" };
      return {
        send: {
          to: contact.email,
          subject: `${contact.channelName} made the video you asked for`,
          text: [
            `You asked ${contact.channelName}: "${news.wording ?? "a challenge"}".`,
            "",
            `The video is out: ${news.videoUrl}`,
            "",
            "This is the only mail about this video. To hear nothing more from this channel's suggestion page:",
            `${deps.appUrl}/suggest/stop/${deps.tokens.make(contactId)}`,
          ].join("\n"),
        },
      };
    }),
  };
}
