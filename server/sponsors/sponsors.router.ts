import { roleLabels } from "../../shared/access/roles";
import { DEFAULT_WORDS_PER_MINUTE } from "../../shared/sponsors/read";
import {
  contactInputSchema,
  settingsInputSchema,
  speakingRateSchema,
  sponsorInputSchema,
  templateInputSchema,
  type SponsorDetail,
  type SponsorSettings,
  type SponsorSummary,
} from "../../shared/sponsors/schemas";
import type { AppDeps } from "../app";
import type { Database } from "../db/client";
import { notFound } from "../http/app-error";
import { memberOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseId } from "../http/validate";
import { dealRoutes } from "./deals.routes";
import { seesFees } from "./deals.service";
import { reviewTokens } from "./review-token";
import {
  deleteContact,
  deleteTemplate,
  findSponsor,
  insertContact,
  insertSponsor,
  insertTemplate,
  isMember,
  listMembersWithRates,
  listSponsorDeals,
  listSponsors,
  listTemplates,
  reminderDaysBefore,
  saveReminderDaysBefore,
  saveSpeakingRate,
  updateContact,
  updateSponsor,
  updateTemplate,
} from "./sponsors.repository";

const base = "/api/channels/:channelId";

const contactOf = (c: { id: string; name: string; email: string; role: string | null }) => ({ id: c.id, name: c.name, email: c.email, role: c.role });

async function settingsOf(db: Database, channelId: string): Promise<SponsorSettings> {
  const [days, members] = await Promise.all([reminderDaysBefore(db, channelId), listMembersWithRates(db, channelId)]);
  return {
    reminderDaysBefore: days,
    hosts: members.map((m) => ({
      userId: m.userId,
      name: m.name,
      role: roleLabels[m.role],
      wordsPerMinute: m.wordsPerMinute ?? DEFAULT_WORDS_PER_MINUTE,
      isDefault: m.wordsPerMinute === null,
    })),
  };
}

export function sponsorsRoutes(deps: AppDeps): RouteSpec[] {
  const db = deps.database.db;
  const review = {
    db,
    appUrl: deps.env.APP_URL,
    tokens: reviewTokens(deps.env.SESSION_SECRET),
    storage: deps.storage ?? null,
    jobs: deps.jobs,
  };
  return [
    {
      method: "get",
      path: `${base}/sponsors`,
      access: channelAccess("sponsors", "R"),
      handler: async (req, res) => {
        const rows = await listSponsors(db, memberOf(req).channelId);
        const sponsors: SponsorSummary[] = rows.map((r) => ({ id: r.id, company: r.company, website: r.website, notes: r.notes, contacts: r.contacts.map(contactOf), dealCount: r.dealCount }));
        res.json({ sponsors });
      },
    },
    {
      method: "post",
      path: `${base}/sponsors`,
      access: channelAccess("sponsors", "W"),
      handler: async (req, res) => {
        const input = parseBody(sponsorInputSchema, req.body);
        const row = await insertSponsor(db, memberOf(req).channelId, input);
        res.status(201).json({ sponsor: { id: row.id, company: row.company, website: row.website, notes: row.notes, contacts: [], dealCount: 0 } });
      },
    },
    {
      method: "get",
      path: `${base}/sponsors/:sponsorId`,
      access: channelAccess("sponsors", "R"),
      handler: async (req, res) => {
        const { channelId, role } = memberOf(req);
        const sponsor = await findSponsor(db, channelId, parseId(req.params.sponsorId, "Sponsor"));
        if (!sponsor) throw notFound("Sponsor");
        const deals = await listSponsorDeals(db, channelId, sponsor.id);
        const detail: SponsorDetail = {
          id: sponsor.id,
          company: sponsor.company,
          website: sponsor.website,
          notes: sponsor.notes,
          contacts: sponsor.contacts.map(contactOf),
          dealCount: deals.length,
          // The fee travels only to roles that may see it.
          deals: deals.map(({ feeAmount, currency, ...deal }) => (seesFees(role) ? { ...deal, money: { fee: Number(feeAmount), currency } } : deal)),
        };
        res.json({ sponsor: detail });
      },
    },
    {
      method: "patch",
      path: `${base}/sponsors/:sponsorId`,
      access: channelAccess("sponsors", "W"),
      handler: async (req, res) => {
        const sponsorId = parseId(req.params.sponsorId, "Sponsor");
        const input = parseBody(sponsorInputSchema, req.body);
        const row = await updateSponsor(db, memberOf(req).channelId, sponsorId, input);
        if (!row) throw notFound("Sponsor");
        res.json({ sponsor: { id: row.id, company: row.company, website: row.website, notes: row.notes } });
      },
    },
    {
      method: "post",
      path: `${base}/sponsors/:sponsorId/contacts`,
      access: channelAccess("sponsors", "W"),
      handler: async (req, res) => {
        const { channelId } = memberOf(req);
        const sponsorId = parseId(req.params.sponsorId, "Sponsor");
        const input = parseBody(contactInputSchema, req.body);
        if (!(await findSponsor(db, channelId, sponsorId))) throw notFound("Sponsor");
        res.status(201).json({ contact: contactOf(await insertContact(db, channelId, sponsorId, input)) });
      },
    },
    {
      method: "patch",
      path: `${base}/sponsors/:sponsorId/contacts/:contactId`,
      access: channelAccess("sponsors", "W"),
      handler: async (req, res) => {
        const sponsorId = parseId(req.params.sponsorId, "Sponsor");
        const contactId = parseId(req.params.contactId, "Contact");
        const input = parseBody(contactInputSchema, req.body);
        const row = await updateContact(db, memberOf(req).channelId, sponsorId, contactId, input);
        if (!row) throw notFound("Contact");
        res.json({ contact: contactOf(row) });
      },
    },
    {
      method: "delete",
      path: `${base}/sponsors/:sponsorId/contacts/:contactId`,
      access: channelAccess("sponsors", "W"),
      handler: async (req, res) => {
        const sponsorId = parseId(req.params.sponsorId, "Sponsor");
        const contactId = parseId(req.params.contactId, "Contact");
        if (!(await deleteContact(db, memberOf(req).channelId, sponsorId, contactId))) throw notFound("Contact");
        res.status(204).end();
      },
    },
    {
      method: "get",
      path: `${base}/deal-templates`,
      access: channelAccess("deliverables", "R"),
      handler: async (req, res) => res.json({ templates: await listTemplates(db, memberOf(req).channelId) }),
    },
    {
      method: "post",
      path: `${base}/deal-templates`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        const input = parseBody(templateInputSchema, req.body);
        res.status(201).json({ template: await insertTemplate(db, memberOf(req).channelId, input) });
      },
    },
    {
      method: "put",
      path: `${base}/deal-templates/:templateId`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        const templateId = parseId(req.params.templateId, "Template");
        const input = parseBody(templateInputSchema, req.body);
        const row = await updateTemplate(db, memberOf(req).channelId, templateId, input);
        if (!row) throw notFound("Template");
        res.json({ template: row });
      },
    },
    {
      method: "delete",
      path: `${base}/deal-templates/:templateId`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        // Deals made from a template keep their items: deleting it changes no deal.
        if (!(await deleteTemplate(db, memberOf(req).channelId, parseId(req.params.templateId, "Template")))) throw notFound("Template");
        res.status(204).end();
      },
    },
    {
      method: "get",
      path: `${base}/sponsor-settings`,
      access: channelAccess("deliverables", "R"),
      handler: async (req, res) => res.json({ settings: await settingsOf(db, memberOf(req).channelId) }),
    },
    {
      method: "put",
      path: `${base}/sponsor-settings`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        const { reminderDaysBefore: days } = parseBody(settingsInputSchema, req.body);
        const { channelId } = memberOf(req);
        await saveReminderDaysBefore(db, channelId, days);
        res.json({ settings: await settingsOf(db, channelId) });
      },
    },
    {
      method: "put",
      path: `${base}/speaking-rates/:userId`,
      access: channelAccess("sponsors", "W"),
      handler: async (req, res) => {
        const { channelId } = memberOf(req);
        const userId = parseId(req.params.userId, "Member");
        const { wordsPerMinute } = parseBody(speakingRateSchema, req.body);
        if (!(await isMember(db, channelId, userId))) throw notFound("Member");
        await saveSpeakingRate(db, channelId, userId, wordsPerMinute);
        res.json({ settings: await settingsOf(db, channelId) });
      },
    },
    ...dealRoutes(db, review),
  ];
}
