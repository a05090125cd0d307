import { randomUUID } from "node:crypto";
import { addDays } from "date-fns";
import { expect } from "vitest";
import { eq } from "drizzle-orm";
import { reviewLinks, sponsorReports } from "../../../server/db/schema/sponsors";
import { reportTokens, reviewTokens } from "../../../server/sponsors/review-token";
import { actOnInvoice, createInvoice } from "../../../server/sponsors/invoices.service";
import { paymentsFrom } from "../../../server/sponsors/payments";
import { suggestedTemplateItems } from "../../../shared/sponsors/deliverables";
import { createContact, createDeal, createSponsor, createTemplate } from "../../factories/sponsors";
import { ok, type AccessContext, type FeatureAccess, type Recipe } from "./matrix";

/*
 * Sponsors and deals (segment requirements): owner and producer W, editor and crew R.
 * Deals' fee, payment terms and invoices (the role table's fees area): owner and producer W, editor and crew nothing.
 * Deliverables: owner and producer W, editor R (W on the cut items they deliver), crew R; the cut
 * (setting a deal's cut, moving a cut item) is the role table's "cut" area: owner, producer, editor W.
 * The sponsor's review page is public: its signed token is the only key.
 */
const c = "/api/channels/:channelId";
export const access: FeatureAccess = {
  rows: [
    // route                                                    visitor owner producer editor crew outsider
    [`GET ${c}/sponsors`,                                        401, ok, ok, ok,  ok,  404],
    [`POST ${c}/sponsors`,                                       401, ok, ok, 403, 403, 404],
    [`GET ${c}/sponsors/:sponsorId`,                             401, ok, ok, ok,  ok,  404],
    [`PATCH ${c}/sponsors/:sponsorId`,                           401, ok, ok, 403, 403, 404],
    [`POST ${c}/sponsors/:sponsorId/contacts`,                   401, ok, ok, 403, 403, 404],
    [`PATCH ${c}/sponsors/:sponsorId/contacts/:contactId`,       401, ok, ok, 403, 403, 404],
    [`DELETE ${c}/sponsors/:sponsorId/contacts/:contactId`,      401, ok, ok, 403, 403, 404],
    [`GET ${c}/deal-templates`,                                  401, ok, ok, ok,  ok,  404],
    [`POST ${c}/deal-templates`,                                 401, ok, ok, 403, 403, 404],
    [`PUT ${c}/deal-templates/:templateId`,                      401, ok, ok, 403, 403, 404],
    [`DELETE ${c}/deal-templates/:templateId`,                   401, ok, ok, 403, 403, 404],
    [`GET ${c}/episodes/:episodeId/deals`,                       401, ok, ok, ok,  ok,  404],
    [`POST ${c}/deals`,                                          401, ok, ok, 403, 403, 404],
    [`GET ${c}/deals/:dealId`,                                   401, ok, ok, ok,  ok,  404],
    [`PATCH ${c}/deals/:dealId`,                                 401, ok, ok, 403, 403, 404],
    [`PUT ${c}/deals/:dealId/episode`,                           401, ok, ok, 403, 403, 404],
    [`PUT ${c}/deals/:dealId/money`,                             401, ok, ok, 403, 403, 404],
    [`PUT ${c}/deals/:dealId/cut`,                               401, ok, ok, ok,  403, 404],
    [`POST ${c}/deals/:dealId/deliverables`,                     401, ok, ok, 403, 403, 404],
    [`PATCH ${c}/deliverables/:deliverableId`,                   401, ok, ok, ok,  403, 404],
    [`DELETE ${c}/deliverables/:deliverableId`,                  401, ok, ok, 403, 403, 404],
    [`POST ${c}/deals/:dealId/review-links`,                     401, ok, ok, 403, 403, 404],
    [`DELETE ${c}/deals/:dealId/review-links/:linkId`,           401, ok, ok, 403, 403, 404],
    ["GET /api/review/:token",                                   ok,  ok, ok, ok,  ok,  ok],
    [`GET ${c}/deals/:dealId/report`,                            401, ok, ok, ok,  ok,  404],
    [`POST ${c}/deals/:dealId/report/pdf`,                       401, ok, ok, 403, 403, 404],
    [`POST ${c}/deals/:dealId/report/send`,                      401, ok, ok, 403, 403, 404],
    ["GET /api/sponsor-report/:token",                           ok,  ok, ok, ok,  ok,  ok],
    ["POST /api/review/:token/decision",                         ok,  ok, ok, ok,  ok,  ok],
    ["POST /api/review/:token/pins",                             ok,  ok, ok, ok,  ok,  ok],
    [`GET ${c}/deals/:dealId/cut/player`,                        401, ok, ok, ok,  ok,  404],
    [`GET ${c}/desk`,                                            401, ok, ok, ok,  ok,  404],
    [`GET ${c}/sponsor-settings`,                                401, ok, ok, ok,  ok,  404],
    [`PUT ${c}/sponsor-settings`,                                401, ok, ok, 403, 403, 404],
    [`PUT ${c}/speaking-rates/:userId`,                          401, ok, ok, 403, 403, 404],
    [`GET ${c}/deals/:dealId/invoices`,                          401, ok, ok, 403, 403, 404],
    [`POST ${c}/deals/:dealId/invoices`,                         401, ok, ok, 403, 403, 404],
    [`POST ${c}/deals/:dealId/invoices/:invoiceId/finalise`,     401, ok, ok, 403, 403, 404],
    [`POST ${c}/deals/:dealId/invoices/:invoiceId/send`,         401, ok, ok, 403, 403, 404],
    [`POST ${c}/deals/:dealId/invoices/:invoiceId/void`,         401, ok, ok, 403, 403, 404],
    [`POST ${c}/deals/:dealId/invoices/:invoiceId/write-off`,    401, ok, ok, 403, 403, 404],
    [`GET ${c}/invoices/overdue`,                                401, ok, ok, 403, 403, 404],
    // The provider's webhook: the signature over the body is the only key, so every caller is read the
    // same way, and a body without one is refused (tests/api/sponsors-invoices.test.ts signs real ones).
    ["POST /api/payments/webhook",                               ok,  ok, ok, ok,  ok,  ok],
  ],
  recipes: sponsorRecipes,
};

const money = { fee: 1200, currency: "EUR", paymentTermsDays: 30, paymentTermsFrom: "invoice", invoiceNumber: null, invoicedOn: null, paidOn: null };

function sponsorRecipes({ app, world }: AccessContext): Record<string, Recipe> {
  const channelId = world.channel.id;
  const one = async (sql: string, params: unknown[]) => (await app.database.pool.query(sql, params)).rows[0];

  async function freshDeal() {
    const sponsor = await createSponsor(app.db, channelId, { company: `Matrix ${randomUUID().slice(0, 6)}` });
    const contact = await createContact(app.db, channelId, sponsor.id);
    const made = await createDeal(app.db, channelId, world.episode.id, { sponsorId: sponsor.id, contactId: contact.id, items: suggestedTemplateItems });
    return { sponsor, contact, deal: made.deal, items: made.items, item: (kind: string) => made.items.find((i) => i.kind === kind)! };
  }

  async function openLink() {
    const { deal, contact, item } = await freshDeal();
    const expiresAt = new Date(Math.floor(addDays(new Date(), 7).getTime() / 1000) * 1000);
    const [link] = await app.db
      .insert(reviewLinks)
      .values({ channelId, dealId: deal.id, deliverableId: item("script_approval").id, contactId: contact.id, contactName: contact.name, contactEmail: contact.email, sentByName: "Matrix", sentByEmail: "", expiresAt })
      .returning();
    return { link: link!, token: reviewTokens(app.deps.env.SESSION_SECRET).sign(link!.id, expiresAt) };
  }

  /** A fresh deal whose report PDF is made (its file stands in: the matrix checks who may send it). */
  async function madeReport() {
    const { deal } = await freshDeal();
    const [report] = await app.db.insert(sponsorReports).values({ channelId, dealId: deal.id, state: "ready", objectKey: `${channelId}/reports/${randomUUID()}.pdf`, pages: 1, sizeBytes: 10, madeAt: new Date() }).returning();
    return { report: report! };
  }

  /** A fresh deal's invoice for its whole fee at the payments stand-in, made as the owner and taken as far as `finalised`. */
  async function invoiced(finalised: boolean) {
    const { deal } = await freshDeal();
    const owner = world.owner;
    const caller = { userId: owner.id, name: owner.name, email: owner.email, emailVerified: true, timeZone: "UTC", channelId, role: "owner" as const };
    const deps = { db: app.db, payments: paymentsFrom(app.deps.env), jobs: app.deps.jobs };
    const invoice = await createInvoice(deps, caller, deal.id, { label: "Whole fee", amount: null });
    if (finalised) await actOnInvoice(deps, caller, deal.id, invoice.id, "finalise");
    const row = async () => one("select status, sent_at from deal_invoices where id = $1", [invoice.id]);
    return { params: { dealId: deal.id, invoiceId: invoice.id }, row };
  }
  const invoiceAction = (finalised: boolean, unchanged: { status: string; sent_at?: null }): Recipe => ({
    ok: 200,
    prepare: async () => {
      const { params, row } = await invoiced(finalised);
      return { params, intact: async () => expect(await row()).toMatchObject(unchanged) };
    },
  });

  let calls = 0;
  const sponsorCompany = async (id: string) => (await one("select company from sponsors where id = $1", [id]))?.company;

  return {
    [`GET ${c}/sponsors`]: { ok: 200 },
    [`POST ${c}/sponsors`]: {
      ok: 201,
      prepare: async () => {
        const company = `Refused ${randomUUID().slice(0, 8)}`;
        return { body: { company, website: null, notes: null }, intact: async () => expect(await one("select 1 from sponsors where company = $1", [company])).toBeUndefined() };
      },
    },
    [`GET ${c}/sponsors/:sponsorId`]: {
      ok: 200,
      prepare: async () => ({ params: { sponsorId: (await createSponsor(app.db, channelId)).id } }),
    },
    [`PATCH ${c}/sponsors/:sponsorId`]: {
      ok: 200,
      prepare: async () => {
        const sponsor = await createSponsor(app.db, channelId, { company: "Before" });
        return { params: { sponsorId: sponsor.id }, body: { company: "After", website: null, notes: null, version: 1 }, intact: async () => expect(await sponsorCompany(sponsor.id)).toBe("Before") };
      },
    },
    [`POST ${c}/sponsors/:sponsorId/contacts`]: {
      ok: 201,
      prepare: async () => {
        const sponsor = await createSponsor(app.db, channelId);
        return {
          params: { sponsorId: sponsor.id },
          body: { name: "New Contact", email: "new-contact@example.com", role: null },
          intact: async () => expect(await one("select count(*)::int as n from sponsor_contacts where sponsor_id = $1", [sponsor.id])).toEqual({ n: 0 }),
        };
      },
    },
    [`PATCH ${c}/sponsors/:sponsorId/contacts/:contactId`]: {
      ok: 200,
      prepare: async () => {
        const sponsor = await createSponsor(app.db, channelId);
        const contact = await createContact(app.db, channelId, sponsor.id, { name: "Before" });
        return {
          params: { sponsorId: sponsor.id, contactId: contact.id },
          body: { name: "After", email: contact.email, role: null, version: 1 },
          intact: async () => expect((await one("select name from sponsor_contacts where id = $1", [contact.id])).name).toBe("Before"),
        };
      },
    },
    [`DELETE ${c}/sponsors/:sponsorId/contacts/:contactId`]: {
      ok: 204,
      prepare: async () => {
        const sponsor = await createSponsor(app.db, channelId);
        const contact = await createContact(app.db, channelId, sponsor.id);
        return { params: { sponsorId: sponsor.id, contactId: contact.id }, intact: async () => expect(await one("select 1 as kept from sponsor_contacts where id = $1", [contact.id])).toEqual({ kept: 1 }) };
      },
    },
    [`GET ${c}/deal-templates`]: { ok: 200 },
    [`POST ${c}/deal-templates`]: {
      ok: 201,
      prepare: async () => {
        const name = `Refused ${randomUUID().slice(0, 8)}`;
        return { body: { name, items: suggestedTemplateItems.slice(0, 2) }, intact: async () => expect(await one("select 1 from deal_templates where name = $1", [name])).toBeUndefined() };
      },
    },
    [`PUT ${c}/deal-templates/:templateId`]: {
      ok: 200,
      prepare: async () => {
        const template = await createTemplate(app.db, channelId, suggestedTemplateItems, "Before");
        return {
          params: { templateId: template.id },
          body: { name: "After", items: suggestedTemplateItems.slice(0, 1), version: 1 },
          intact: async () => expect((await one("select name from deal_templates where id = $1", [template.id])).name).toBe("Before"),
        };
      },
    },
    [`DELETE ${c}/deal-templates/:templateId`]: {
      ok: 204,
      prepare: async () => {
        const template = await createTemplate(app.db, channelId);
        return { params: { templateId: template.id }, intact: async () => expect(await one("select 1 as kept from deal_templates where id = $1", [template.id])).toEqual({ kept: 1 }) };
      },
    },
    [`GET ${c}/episodes/:episodeId/deals`]: { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    [`POST ${c}/deals`]: {
      ok: 201,
      prepare: async () => {
        const sponsor = await createSponsor(app.db, channelId);
        return {
          body: {
            episodeId: world.episode.id,
            sponsorId: sponsor.id,
            templateId: null,
            state: "signed",
            placement: "opening",
            segmentSeconds: 45,
            talkingPoints: [],
            link: null,
            promoCode: null,
            disclosureText: null,
            exclusivityNotes: null,
            descriptionCopy: null,
            contactId: null,
            hostId: null,
            goLiveDate: null,
            money,
          },
          intact: async () => expect(await one("select count(*)::int as n from deals where sponsor_id = $1", [sponsor.id])).toEqual({ n: 0 }),
        };
      },
    },
    [`GET ${c}/deals/:dealId`]: { ok: 200, prepare: async () => ({ params: { dealId: (await freshDeal()).deal.id } }) },
    [`PATCH ${c}/deals/:dealId`]: {
      ok: 200,
      prepare: async () => {
        const { deal } = await freshDeal();
        return { params: { dealId: deal.id }, body: { script: "Changed", version: 1 }, intact: async () => expect((await one("select script from deals where id = $1", [deal.id])).script).toBe("") };
      },
    },
    [`PUT ${c}/deals/:dealId/episode`]: {
      ok: 200,
      prepare: async () => {
        const sponsor = await createSponsor(app.db, channelId, { company: `Matrix ${randomUUID().slice(0, 6)}` });
        const { deal } = await createDeal(app.db, channelId, null, { sponsorId: sponsor.id, items: suggestedTemplateItems });
        return {
          params: { dealId: deal.id },
          body: { episodeId: world.episode.id, version: 1 },
          intact: async () => expect((await one("select episode_id from deals where id = $1", [deal.id])).episode_id).toBeNull(),
        };
      },
    },
    [`PUT ${c}/deals/:dealId/money`]: {
      ok: 200,
      prepare: async () => {
        const { deal } = await freshDeal();
        return { params: { dealId: deal.id }, body: { ...money, fee: 1, version: 1 }, intact: async () => expect((await one("select fee_amount from deals where id = $1", [deal.id])).fee_amount).toBe("4321.0000") };
      },
    },
    [`PUT ${c}/deals/:dealId/cut`]: {
      ok: 200,
      prepare: async () => {
        const { deal } = await freshDeal();
        return {
          params: { dealId: deal.id },
          body: { clipId: null, timing: { inTimecode: "00:00:10:00", outTimecode: "00:01:10:00", frameRate: "25", dropFrame: false }, version: 1 },
          intact: async () => expect((await one("select cut_in from deals where id = $1", [deal.id])).cut_in).toBeNull(),
        };
      },
    },
    [`POST ${c}/deals/:dealId/deliverables`]: {
      ok: 201,
      prepare: async () => {
        const { deal, items } = await freshDeal();
        return {
          params: { dealId: deal.id },
          body: { kind: "other", title: "Extra item", anchor: "fixed", fixedDate: "2027-05-01" },
          intact: async () => expect(await one("select count(*)::int as n from deliverables where deal_id = $1", [deal.id])).toEqual({ n: items.length }),
        };
      },
    },
    [`PATCH ${c}/deliverables/:deliverableId`]: {
      ok: 200,
      // The draft cut: the one kind of item the editor may move.
      prepare: async () => {
        const { item } = await freshDeal();
        const cut = item("draft_cut");
        return { params: { deliverableId: cut.id }, body: { status: "sent", version: 1 }, intact: async () => expect((await one("select status::text from deliverables where id = $1", [cut.id])).status).toBe("not_started") };
      },
    },
    [`DELETE ${c}/deliverables/:deliverableId`]: {
      ok: 204,
      prepare: async () => {
        const { item } = await freshDeal();
        const target = item("report");
        return { params: { deliverableId: target.id }, intact: async () => expect(await one("select 1 as kept from deliverables where id = $1", [target.id])).toEqual({ kept: 1 }) };
      },
    },
    [`POST ${c}/deals/:dealId/review-links`]: {
      ok: 201,
      prepare: async () => {
        const { deal, contact, item } = await freshDeal();
        return {
          params: { dealId: deal.id },
          body: { deliverableId: item("script_approval").id, contactId: contact.id },
          intact: async () => expect(await one("select count(*)::int as n from review_links where deal_id = $1", [deal.id])).toEqual({ n: 0 }),
        };
      },
    },
    [`DELETE ${c}/deals/:dealId/review-links/:linkId`]: {
      ok: 204,
      prepare: async () => {
        const { link } = await openLink();
        return { params: { dealId: link.dealId, linkId: link.id }, intact: async () => expect((await one("select revoked_at from review_links where id = $1", [link.id])).revoked_at).toBeNull() };
      },
    },
    [`GET ${c}/deals/:dealId/report`]: { ok: 200, prepare: async () => ({ params: { dealId: (await freshDeal()).deal.id } }) },
    [`POST ${c}/deals/:dealId/report/pdf`]: {
      ok: 202,
      prepare: async () => {
        const { deal } = await freshDeal();
        return { params: { dealId: deal.id }, intact: async () => expect(await one("select count(*)::int as n from sponsor_reports where deal_id = $1", [deal.id])).toEqual({ n: 0 }) };
      },
    },
    [`POST ${c}/deals/:dealId/report/send`]: {
      ok: 200,
      prepare: async () => {
        const { report } = await madeReport();
        return { params: { dealId: report.dealId }, body: {}, intact: async () => expect((await one("select sent_at from sponsor_reports where id = $1", [report.id])).sent_at).toBeNull() };
      },
    },
    ["GET /api/sponsor-report/:token"]: {
      ok: 200,
      prepare: async () => {
        const { report } = await madeReport();
        const expiresAt = new Date(Math.floor(addDays(new Date(), 7).getTime() / 1000) * 1000);
        await app.db.update(sponsorReports).set({ sentTo: "sponsor@example.com", sentAt: new Date(), linkExpiresAt: expiresAt }).where(eq(sponsorReports.id, report.id));
        return { params: { token: reportTokens(app.deps.env.SESSION_SECRET).link.sign(report.id, expiresAt) } };
      },
    },
    ["GET /api/review/:token"]: { ok: 200, prepare: async () => ({ params: { token: (await openLink()).token } }) },
    ["POST /api/review/:token/decision"]: {
      ok: 200,
      // The decision names what the page showed (its "seen"), as the review page sends it.
      prepare: async () => {
        const { token } = await openLink();
        const page = await (await app.visitor()).get(`/api/review/${token}`);
        return { params: { token }, body: { decision: "approved", comment: null, seen: page.body.seen } };
      },
    },
    // A pin needs a segment: the link's deal gets a clip row (the page reads no bytes of it).
    ["POST /api/review/:token/pins"]: {
      ok: 201,
      prepare: async () => {
        const { link, token } = await openLink();
        const [clip] = (
          await app.database.pool.query(
            `insert into clips (channel_id, episode_id, object_key, file_name, content_type, size_bytes, duration_ms, recorded_at)
             values ($1, $2, $3, 'draft.mp4', 'video/mp4', 1, 6000, now()) returning id`,
            [channelId, world.episode.id, `${channelId}/${world.episode.id}/${randomUUID()}`],
          )
        ).rows;
        await app.database.pool.query("update deals set cut_clip_id = $1 where id = $2", [clip.id, link.dealId]);
        return { params: { token }, body: { atSeconds: 1.5, note: "Logo too small here" }, intact: async () => expect(await one("select count(*)::int as n from review_pins where link_id = $1", [link.id])).toEqual({ n: 0 }) };
      },
    },
    [`GET ${c}/deals/:dealId/cut/player`]: { ok: 200, prepare: async () => ({ params: { dealId: (await freshDeal()).deal.id } }) },
    [`GET ${c}/desk`]: { ok: 200 },
    [`GET ${c}/sponsor-settings`]: { ok: 200 },
    [`PUT ${c}/sponsor-settings`]: {
      ok: 200,
      // A value no earlier cell used, so a refusal can be seen to have left it unsaved.
      prepare: async () => {
        const days = 5 + (calls++ % 20);
        return { body: { reminderDaysBefore: days }, intact: async () => expect(await one("select 1 from sponsor_settings where channel_id = $1 and reminder_days_before = $2", [channelId, days])).toBeUndefined() };
      },
    },
    [`PUT ${c}/speaking-rates/:userId`]: {
      ok: 200,
      prepare: async () => {
        const rate = 100 + (calls++ % 100);
        return {
          params: { userId: world.owner.id },
          body: { wordsPerMinute: rate },
          intact: async () => expect(await one("select 1 from speaking_rates where user_id = $1 and words_per_minute = $2", [world.owner.id, rate])).toBeUndefined(),
        };
      },
    },
    [`GET ${c}/deals/:dealId/invoices`]: { ok: 200, prepare: async () => ({ params: { dealId: (await freshDeal()).deal.id } }) },
    [`POST ${c}/deals/:dealId/invoices`]: {
      ok: 201,
      prepare: async () => {
        const { deal } = await freshDeal();
        return {
          params: { dealId: deal.id },
          body: { label: "Whole fee", amount: null },
          intact: async () => expect(await one("select count(*)::int as n from deal_invoices where deal_id = $1", [deal.id])).toEqual({ n: 0 }),
        };
      },
    },
    [`POST ${c}/deals/:dealId/invoices/:invoiceId/finalise`]: invoiceAction(false, { status: "draft" }),
    [`POST ${c}/deals/:dealId/invoices/:invoiceId/send`]: invoiceAction(true, { status: "open", sent_at: null }),
    [`POST ${c}/deals/:dealId/invoices/:invoiceId/void`]: invoiceAction(true, { status: "open" }),
    [`POST ${c}/deals/:dealId/invoices/:invoiceId/write-off`]: invoiceAction(true, { status: "open" }),
    [`GET ${c}/invoices/overdue`]: { ok: 200 },
    // Unsigned: refused for everyone alike.
    ["POST /api/payments/webhook"]: { ok: 400, prepare: async () => ({ body: { id: "evt_unsigned", type: "invoice.paid" } }) },
  };
}
