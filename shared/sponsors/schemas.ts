import { z } from "zod";
import { amountDecimalTextSchema } from "../fields/amounts";
import { decimalsOf, minorUnitDigits, MOST_MINOR_DIGITS, tooManyDecimals } from "../money/minor-units";
import { type FrameRateName, frameRateNames, frameRates, labelsDroppedPerMinute } from "../timecode/rates";
import { checkTimecode } from "../timecode/timecode";
import { emailSchema } from "../auth/schemas";
import { calendarDateSchema } from "../fields/dates";
import { multiLine, oneLine } from "../fields/text";
import { deliverableKinds, deliverableStatuses, anchors, templateAnchors, deskGroups } from "./deliverables";
import { MAX_WORDS_PER_MINUTE, MIN_WORDS_PER_MINUTE, type ReadReport } from "./read";
import type { DisclosureCheck } from "./disclosure";

const id = (what: string) => z.uuid({ error: `Pick a ${what}.` });

// Free text goes through the shared text rule (shared/fields/text.ts): no control or direction
// characters (NUL included, which PostgreSQL text can't hold), nothing blank that only looks filled.
const tooLong = (max: number, what: string) => `Keep the ${what} under ${max} characters.`;
const blankToNull = (v: string) => (v === "" ? null : v);

/** Optional one-line text: blank becomes null. */
const optionalLine = (max: number, what: string) => oneLine(max, { tooLong: tooLong(max, what) }).transform(blankToNull).nullable();
/** Optional notes that keep their line breaks: blank becomes null. */
const optionalLines = (max: number, what: string) => multiLine(max, { tooLong: tooLong(max, what) }).transform(blankToNull).nullable();

const requiredText = (max: number, message: string) => oneLine(max, { blank: message, tooLong: `Use at most ${max} characters.` });

export const isoDateSchema = calendarDateSchema;
/** An optional date: blank becomes null. */
const optionalDate = z.string().trim().transform(blankToNull).nullable().pipe(calendarDateSchema.nullable());

const webAddress = oneLine(500, { tooLong: "Keep the address under 500 characters." })
  .transform(blankToNull)
  .nullable()
  .refine((v) => v === null || /^https?:\/\/[^\s/]+\.[^\s]+$/i.test(v), { message: "Enter a web address starting with https://" });

// ── Sponsors and contacts ───────────────────────────────────────────────

export const sponsorInputSchema = z.strictObject({
  company: requiredText(120, "Name the company."),
  website: webAddress,
  notes: optionalLines(2000, "notes"),
});
export type SponsorInput = z.input<typeof sponsorInputSchema>;

export const contactInputSchema = z.strictObject({
  name: requiredText(80, "Enter the contact's name."),
  email: emailSchema,
  role: optionalLine(80, "role"),
});
export type ContactInput = z.input<typeof contactInputSchema>;

export interface Contact {
  id: string;
  name: string;
  email: string;
  role: string | null;
  version: number;
}

export interface SponsorSummary {
  id: string;
  company: string;
  website: string | null;
  notes: string | null;
  contacts: Contact[];
  dealCount: number;
  version: number;
}

export interface SponsorDealRow {
  id: string;
  /** The deal's version: tying it to an episode names it. */
  version: number;
  /** Null while a signed deal waits for its episode. */
  episodeId: string | null;
  episodeTitle: string | null;
  state: DealState;
  placement: Placement;
  publishDate: string | null;
  /** Only for roles that see fees. */
  money?: { fee: number; currency: string };
}

export interface SponsorDetail extends SponsorSummary {
  deals: SponsorDealRow[];
  /** The channel's episodes that aren't archived: where a deal waiting for its episode can be tied. */
  episodes: { id: string; title: string; publishDate: string | null }[];
}

// ── Templates ──────────────────────────────────────────────────────────

export const templateItemSchema = z.strictObject({
  kind: z.enum(deliverableKinds, { error: "Pick what the item is." }),
  title: requiredText(120, "Name the item."),
  anchor: z.enum(templateAnchors, { error: "Count the date before publish or after go-live." }),
  offsetDays: z
    .number({ error: "Enter a number of days." })
    .int("Use whole days.")
    .min(0, "Use 0 or more days.")
    .max(365, "Use at most 365 days."),
  ownerRole: z.enum(["owner", "producer", "editor"]).nullable(),
  approves: z.number({ error: "Pick the item this one approves." }).int("Pick the item this one approves.").min(0, "Pick the item this one approves.").nullable().default(null),
});

export const templateInputSchema = z.strictObject({
  name: requiredText(80, "Name the template."),
  items: z
    .array(templateItemSchema)
    .min(1, "Add at least one item.")
    .max(30, "Keep a template to 30 items.")
    .superRefine((items, ctx) => {
      items.forEach((item, index) => {
        if (item.approves === null) return;
        if (item.approves === index || item.approves >= items.length) {
          ctx.addIssue({ code: "custom", path: [index, "approves"], message: "Pick another item of this template for this one to approve." });
        }
      });
    }),
});
export type TemplateInput = z.input<typeof templateInputSchema>;

export interface DealTemplate {
  id: string;
  name: string;
  // Input shape: templates saved before items could be paired have no "approves".
  items: z.input<typeof templateItemSchema>[];
  version: number;
}

// ── Deals ──────────────────────────────────────────────────────────────

export const dealStates = ["negotiating", "signed", "live", "wrapped", "cancelled"] as const;
export type DealState = (typeof dealStates)[number];
export const dealStateLabels: Record<DealState, string> = {
  negotiating: "Negotiating",
  signed: "Signed",
  live: "Live",
  wrapped: "Wrapped",
  cancelled: "Cancelled",
};

export const placements = ["opening", "middle", "end"] as const;
export type Placement = (typeof placements)[number];
export const placementLabels: Record<Placement, string> = { opening: "Opening", middle: "Middle", end: "End" };

export const paymentTermsFrom = ["go_live", "invoice"] as const;
export const paymentTermsLabels: Record<(typeof paymentTermsFrom)[number], string> = { go_live: "after go-live", invoice: "after the invoice" };

const talkingPointsSchema = z
  .array(oneLine(200, { blank: "A talking point can't be blank.", tooLong: "Keep each talking point under 200 characters." }))
  .max(20, "Keep it to 20 talking points.");

const segmentFields = {
  state: z.enum(dealStates, { error: "Pick the deal's state." }),
  placement: z.enum(placements, { error: "Pick opening, middle or end." }),
  segmentSeconds: z
    .number({ error: "Enter the contracted length in seconds." })
    .int("Use whole seconds.")
    .min(5, "A segment is at least 5 seconds.")
    .max(900, "A segment is at most 900 seconds (15 minutes)."),
  talkingPoints: talkingPointsSchema,
  link: webAddress,
  promoCode: optionalLine(40, "promo code").refine((v) => v === null || /^\S+$/.test(v), { message: "A promo code has no spaces." }),
  disclosureText: optionalLine(300, "disclosure"),
  exclusivityNotes: optionalLines(1000, "exclusivity notes"),
  descriptionCopy: optionalLines(3000, "description text"),
  script: multiLine(20000, { tooLong: "Keep the script under 20,000 characters." }),
  contactId: id("contact").nullable(),
  hostId: id("host").nullable(),
  goLiveDate: optionalDate,
};

/** A deal's money as sent; the fee's decimals are checked against its currency's by `moneySchema`. */
export const moneyFields = {
  fee: amountDecimalTextSchema("fee", 1_000_000_000, MOST_MINOR_DIGITS),
  currency: z
    .string({ error: "Enter a currency code." })
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{3}$/, "Use a three-letter currency code (ISO 4217), e.g. EUR."),
  paymentTermsDays: z.number({ error: "Enter the payment terms in days." }).int("Use whole days.").min(0, "Use 0 or more days.").max(365, "Use at most 365 days."),
  paymentTermsFrom: z.enum(paymentTermsFrom, { error: "Count the terms from go-live or the invoice." }),
  invoiceNumber: optionalLine(60, "invoice number"),
  invoicedOn: optionalDate,
  paidOn: optionalDate,
};

/** A deal's money: the fee in as many decimals as its currency has (ISO 4217's minor unit: none for JPY, three for KWD). */
export const moneySchema = z
  .strictObject(moneyFields)
  .superRefine((money, ctx) => {
    if (decimalsOf(money.fee) > minorUnitDigits(money.currency)) ctx.addIssue({ code: "custom", path: ["fee"], message: tooManyDecimals(money.currency) });
  })
  .transform(({ fee, ...money }) => ({ fee: Number(fee), ...money }));
export type MoneyInput = z.input<typeof moneySchema>;
export type Money = z.infer<typeof moneySchema>;

export const createDealSchema = z.strictObject({
  // Null: a deal signed before its episode exists, recorded against the sponsor and tied later.
  episodeId: id("episode").nullable().default(null),
  sponsorId: id("sponsor"),
  templateId: id("template").nullable(),
  ...segmentFields,
  script: segmentFields.script.default(""),
  talkingPoints: talkingPointsSchema.default([]),
  money: moneySchema,
});
export type CreateDealInput = z.input<typeof createDealSchema>;

/** A change of some segment fields: the form sends only those it changed (and, beside them, the deal's version). */
export const updateDealSchema = z
  .strictObject(segmentFields)
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: "Change at least one field." });
export type UpdateDealInput = z.input<typeof updateDealSchema>;

/** Ties a deal recorded against its sponsor to the episode that carries it; its items are dated from then on. */
export const tieDealSchema = z.strictObject({ episodeId: id("episode") });
export type TieDealInput = z.input<typeof tieDealSchema>;

export const cutTimingSchema = z
  .strictObject({
    inTimecode: oneLine(40, { blank: "Enter the segment's in point." }),
    outTimecode: oneLine(40, { blank: "Enter the segment's out point." }),
    frameRate: z.enum(frameRateNames as [FrameRateName, ...FrameRateName[]], { error: "Pick the cut's frame rate." }),
    dropFrame: z.boolean(),
  })
  .superRefine((v, ctx) => {
    const format = { rate: frameRates[v.frameRate], dropFrame: v.dropFrame };
    if (v.dropFrame && labelsDroppedPerMinute(format.rate) === undefined) {
      ctx.addIssue({ code: "custom", path: ["dropFrame"], message: "Drop-frame exists only at 29.97 and 59.94 fps." });
      return;
    }
    const first = checkTimecode(v.inTimecode, format);
    const end = checkTimecode(v.outTimecode, format);
    if (!first.ok) ctx.addIssue({ code: "custom", path: ["inTimecode"], message: first.message });
    if (!end.ok) ctx.addIssue({ code: "custom", path: ["outTimecode"], message: end.message });
    if (first.ok && end.ok && end.frame <= first.frame) ctx.addIssue({ code: "custom", path: ["outTimecode"], message: "The out point must come after the in point." });
  });
export type CutTimingInput = z.input<typeof cutTimingSchema>;

/** The editor's part of a deal: the clip sent for review and the segment's in and out in the cut. */
export const cutSchema = z.strictObject({
  clipId: z.uuid({ error: "Pick a clip." }).nullable(),
  timing: cutTimingSchema.nullable(),
});
export type CutInput = z.input<typeof cutSchema>;

// ── Deliverables ───────────────────────────────────────────────────────

export const newDeliverableSchema = z
  .strictObject({
    kind: z.enum(deliverableKinds, { error: "Pick what the item is." }),
    title: requiredText(120, "Name the item."),
    anchor: z.enum(anchors, { error: "Pick how the date is counted." }),
    offsetDays: templateItemSchema.shape.offsetDays.default(0),
    fixedDate: optionalDate.default(null),
    ownerId: id("owner").nullable().default(null),
  })
  .refine((v) => v.anchor !== "fixed" || v.fixedDate !== null, { message: "Enter the date.", path: ["fixedDate"] });
export type NewDeliverableInput = z.input<typeof newDeliverableSchema>;

export const updateDeliverableSchema = z
  .strictObject({
    title: requiredText(120, "Name the item."),
    status: z.enum(deliverableStatuses, { error: "Pick a status." }),
    ownerId: id("owner").nullable(),
    anchor: z.enum(anchors, { error: "Pick how the date is counted." }),
    offsetDays: templateItemSchema.shape.offsetDays,
    fixedDate: optionalDate,
    note: optionalLines(1000, "note"),
  })
  .partial()
  .refine((v) => Object.keys(v).some((k) => k !== "note") || v.note, { message: "Change at least one field." })
  .refine((v) => v.anchor !== "fixed" || (v.fixedDate !== undefined && v.fixedDate !== null), { message: "Enter the date.", path: ["fixedDate"] });
export type UpdateDeliverableInput = z.input<typeof updateDeliverableSchema>;

export interface DeliverableEvent {
  id: string;
  at: string;
  actorName: string;
  /** "member" or "sponsor" (a decision made through a review link). */
  actorKind: "member" | "sponsor" | "system";
  what: "created" | "status" | "due_moved" | "owner" | "edited" | "note" | "review_sent" | "review_decision" | "reminder";
  fromStatus: string | null;
  toStatus: string | null;
  fromDate: string | null;
  toDate: string | null;
  note: string | null;
}

export interface DeliverableView {
  id: string;
  dealId: string;
  kind: (typeof deliverableKinds)[number];
  title: string;
  anchor: (typeof anchors)[number];
  offsetDays: number;
  dueDate: string | null;
  status: (typeof deliverableStatuses)[number];
  ownerId: string | null;
  ownerName: string | null;
  version: number;
  late: boolean;
  daysLate: number;
  /** May the caller change this item (status at least)? */
  canEdit: boolean;
  history: DeliverableEvent[];
}

// ── Review links ───────────────────────────────────────────────────────

export const REVIEW_LINK_DEFAULT_DAYS = 7;
export const sendReviewSchema = z.strictObject({
  deliverableId: id("item to review"),
  contactId: id("contact"),
  expiresInDays: z.number({ error: "Enter how many days the link works." }).int("Use whole days.").min(1, "At least 1 day.").max(30, "At most 30 days.").default(REVIEW_LINK_DEFAULT_DAYS),
  // No message of the sender's own: the mail to the sponsor carries only Kerf's words and the names.
});
export type SendReviewInput = z.input<typeof sendReviewSchema>;

/** "closed": what the link belongs to is gone (its contact removed, its deal cancelled, its item removed or settled). */
export const reviewLinkStates = ["open", "decided", "expired", "revoked", "closed"] as const;
export type ReviewLinkState = (typeof reviewLinkStates)[number];
export const reviewDecisions = ["approved", "changes_asked"] as const;
export type ReviewDecision = (typeof reviewDecisions)[number];

export interface ReviewLinkView {
  id: string;
  deliverableId: string;
  deliverableTitle: string;
  contactName: string;
  contactEmail: string;
  sentByName: string;
  sentAt: string;
  expiresAt: string;
  state: ReviewLinkState;
  decision: ReviewDecision | null;
  comment: string | null;
  decidedAt: string | null;
}

export const reviewDecisionSchema = z
  .strictObject({
    decision: z.enum(reviewDecisions, { error: "Approve, or ask for changes." }),
    comment: optionalLines(2000, "comment").default(null),
    /** The page's `seen`: the decision applies only if the review still shows what the sponsor read. */
    seen: z.string({ error: "Reload the page, then decide." }).regex(/^[A-Za-z0-9_-]{16,64}$/, "Reload the page, then decide."),
  })
  .refine((v) => v.decision !== "changes_asked" || v.comment !== null, { message: "Say what should change.", path: ["comment"] });
export type ReviewDecisionInput = z.input<typeof reviewDecisionSchema>;

/** Most comments one review link may pin, and how many in one minute (a person types a few; a script would not stop). */
export const PINS_PER_LINK = 100;
export const PINS_PER_MINUTE = 12;

/** A comment the sponsor pins to a moment of the segment: seconds from the segment's in point. */
export const reviewPinSchema = z.strictObject({
  atSeconds: z.number({ error: "Pause the player where the comment belongs." }).min(0, "Pause the player where the comment belongs.").max(24 * 3600, "That moment is past the segment's end."),
  note: multiLine(1000, { blank: "Write the comment.", tooLong: tooLong(1000, "comment") }),
});
export type ReviewPinInput = z.input<typeof reviewPinSchema>;

/** A pinned comment as the review page and the deal's cut show it. */
export interface ReviewPinView {
  id: string;
  atSeconds: number;
  note: string;
  contactName: string;
  createdAt: string;
  /** The clip's timecode label of the frame on screen at that moment (members only; null without a frame rate). */
  timecode?: string | null;
  deliverableTitle?: string | null;
}

/** The part of the file the sponsor reviews: the player plays from start to end and nowhere else. */
export interface ReviewSegment {
  startSeconds: number;
  endSeconds: number;
  /** A draft cut file is the segment as a whole. */
  wholeFile: boolean;
  /** The clip's frame rate, as the cut counts its frames ("25"); null when the clip doesn't say. */
  frameRate: string | null;
}

/** What the sponsor's contact sees through a link: one deal's segment, never its fee. */
export type ReviewPage =
  | {
      state: "open";
      channelName: string;
      company: string;
      contactName: string;
      episodeTitle: string;
      deliverableTitle: string;
      expiresAt: string;
      script: string;
      segmentSeconds: number;
      estimatedSeconds: number;
      talkingPoints: string[];
      link: string | null;
      promoCode: string | null;
      disclosureText: string | null;
      placement: Placement;
      /** A presigned address of the attached cut, when there is one and storage is configured. */
      cutUrl: string | null;
      /** Where in that file the segment runs; null without a cut. */
      segment: ReviewSegment | null;
      /** The comments pinned through this link, in the segment's order. */
      pins: ReviewPinView[];
      /** A fingerprint of what this page shows; the decision sends it back. */
      seen: string;
    }
  | { state: "decided"; channelName: string; decision: ReviewDecision; decidedAt: string; contactName: string }
  | { state: "expired" | "revoked"; channelName: string }
  | { state: "closed"; channelName: string; reason: string };

// ── Deal view ──────────────────────────────────────────────────────────

export interface CutTiming {
  inTimecode: string;
  outTimecode: string;
  frameRate: string;
  dropFrame: boolean;
  measuredSeconds: number;
}

export interface DealView {
  id: string;
  /** The deal's version: its segment, script, money and cut saves each name it. */
  version: number;
  /** Null while the deal waits for its episode (its items wait for a publish date too). */
  episodeId: string | null;
  episodeTitle: string | null;
  publishDate: string | null;
  sponsor: { id: string; company: string };
  contact: Contact | null;
  contacts: Contact[];
  state: DealState;
  placement: Placement;
  segmentSeconds: number;
  talkingPoints: string[];
  link: string | null;
  promoCode: string | null;
  disclosureText: string | null;
  exclusivityNotes: string | null;
  descriptionCopy: string | null;
  script: string;
  goLiveDate: string | null;
  host: { id: string | null; name: string | null; wordsPerMinute: number };
  read: ReadReport;
  disclosure: DisclosureCheck & { linkInDescription: boolean | null; codeInDescription: boolean | null };
  cut: {
    clip: { id: string; fileName: string; durationSeconds: number; frameRate: string | null } | null;
    timing: CutTiming | null;
    /** Where the segment runs in the clip, when a clip is attached and its in and out fit it. */
    segment?: ReviewSegment | null;
    /** A presigned address to play the clip (an hour), for the members who see the cut. */
    playUrl?: string | null;
    /** The sponsor's comments pinned to moments of the segment, through every review link of the deal. */
    pins?: ReviewPinView[];
  };
  /** Clips of the episode that can be attached as the cut; only for roles that deliver the cut. */
  cutChoices?: { id: string; fileName: string; frameRate: string | null; dropFrame: boolean; startTimecode: string | null }[];
  deliverables: DeliverableView[];
  /** Only for roles that run deliverables (owner, producer). */
  reviewLinks?: ReviewLinkView[];
  /** Only for roles that see fees (owner, producer): the API leaves it out for everyone else. */
  money?: Money;
}

// ── Desk and settings ─────────────────────────────────────────────────

export const deskFilterSchema = z.strictObject({
  sponsorId: z.uuid().optional(),
  episodeId: z.uuid().optional(),
});

export interface DeskItem {
  id: string;
  dealId: string;
  episodeId: string;
  episodeTitle: string;
  sponsorId: string;
  company: string;
  kind: (typeof deliverableKinds)[number];
  title: string;
  dueDate: string | null;
  status: (typeof deliverableStatuses)[number];
  /** The item's version, sent back with a status changed from the desk. */
  version: number;
  ownerName: string | null;
  group: (typeof deskGroups)[number];
  daysLate: number;
  /** Whether the caller may change this item's status from the desk. */
  canEdit: boolean;
}

export interface DeskView {
  today: string;
  counts: Record<(typeof deskGroups)[number], number>;
  items: DeskItem[];
  sponsors: { id: string; company: string }[];
  episodes: { id: string; title: string }[];
}

export const settingsInputSchema = z.strictObject({
  reminderDaysBefore: z.number({ error: "Enter a number of days." }).int("Use whole days.").min(0, "Use 0 or more days.").max(30, "Use at most 30 days."),
});
export type SettingsInput = z.input<typeof settingsInputSchema>;

export const speakingRateSchema = z.strictObject({
  wordsPerMinute: z
    .number({ error: "Enter words per minute." })
    .int("Use a whole number.")
    .min(MIN_WORDS_PER_MINUTE, `Use at least ${MIN_WORDS_PER_MINUTE} words a minute.`)
    .max(MAX_WORDS_PER_MINUTE, `Use at most ${MAX_WORDS_PER_MINUTE} words a minute.`),
});
export type SpeakingRateInput = z.input<typeof speakingRateSchema>;

export interface SponsorSettings {
  reminderDaysBefore: number;
  hosts: { userId: string; name: string; role: string; wordsPerMinute: number; isDefault: boolean }[];
}
