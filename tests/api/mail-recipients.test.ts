import { afterEach, describe, expect, it } from "vitest";
import { scanReminders } from "../../server/sponsors/reminders";
import { dateInZone, shiftDate } from "../../shared/sponsors/dates";
import { addMember, createCrewedChannel, createUser } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createInvitation, uniqueEmail } from "../factories/invitations";
import { createContact, createDeal, createItemDue, createSponsor } from "../factories/sponsors";
import { settledJobs } from "../support/jobs";
import { mailTo, waitForMail } from "../support/mailbox";
import { startTestApp, type TestApp } from "../support/test-app";
import { newEpisode } from "./slate-support";

/*
 * Who gets a mail is decided when it is sent, not when it was queued. Most tests queue mail with the
 * worker held, change the channel, then let the worker run and wait for the job to settle.
 */
const apps: TestApp[] = [];
async function app(options: { holdMail?: boolean } = {}) {
  const started = await startTestApp(options);
  apps.push(started);
  return started;
}
afterEach(async () => {
  while (apps.length) await apps.pop()!.close();
});

async function removeMember(kerf: TestApp, owner: { email: string; password: string }, channelId: string, userId: string) {
  await (await kerf.signedIn(owner)).send("delete", `/api/channels/${channelId}/members/${userId}`).expect(204);
}

const anyJob = () => true;

describe("mail checks its recipient when it is sent", () => {
  it("when a mentioned member is removed before the mail goes out, then they get nothing and the job says why", async () => {
    const kerf = await app({ holdMail: true });
    const { channel, owner, editor } = await createCrewedChannel(kerf.db, "Mention Bench");
    const agent = await kerf.signedIn(owner);
    const episode = await newEpisode(agent, channel.id, { title: "Loose bolts" });
    await agent.send("post", `/api/channels/${channel.id}/episodes/${episode.id}/comments`, { body: "@Edda Editor can you check the bolt shot?" }).expect(201);
    await removeMember(kerf, owner, channel.id, editor.id);

    await kerf.startMailWorker();
    const [job] = await settledJobs(kerf.database.pool, "mail", anyJob, 1);
    expect(await mailTo(editor.email)).toEqual([]);
    expect(job!.output).toEqual({ outcome: "skipped", reason: "the recipient is no longer a member" });
  });

  it("when an item's owner is removed after its reminder was queued, then the reminder is not sent", async () => {
    const kerf = await app({ holdMail: true });
    const world = await createCrewedChannel(kerf.db, "Reminder Leavers");
    const today = dateInZone(new Date(), world.producer.timeZone);
    await createItemDue(kerf.db, world.channel.id, { ownerId: world.producer.id, dueDate: shiftDate(today, 1), title: "Ship the sample back" });
    expect((await scanReminders({ db: kerf.db, pool: kerf.database.pool, jobs: kerf.jobs, appUrl: "http://kerf.test" } as Parameters<typeof scanReminders>[0])).sent).toBe(1);
    await removeMember(kerf, world.owner, world.channel.id, world.producer.id);

    await kerf.startMailWorker();
    const [job] = await settledJobs(kerf.database.pool, "mail", anyJob, 1);
    expect(await mailTo(world.producer.email)).toEqual([]);
    expect(job!.output).toMatchObject({ outcome: "skipped" });
  });

  it("when members lose the role a queued mail needs, then the mail is not sent: a payment reminder to a producer made editor, an invitation from an owner made producer", async () => {
    const kerf = await app({ holdMail: true });
    const world = await createCrewedChannel(kerf.db, "Role Changes");
    const coOwner = await createUser(kerf.db, { name: "Cleo Coowner" });
    await addMember(kerf.db, world.channel.id, coOwner, "owner");
    const today = dateInZone(new Date(), world.producer.timeZone);
    await createItemDue(kerf.db, world.channel.id, { ownerId: world.producer.id, dueDate: shiftDate(today, 1), title: "Chase the payment", kind: "payment" });
    expect((await scanReminders({ db: kerf.db, pool: kerf.database.pool, jobs: kerf.jobs, appUrl: "http://kerf.test" } as Parameters<typeof scanReminders>[0])).sent).toBe(1);
    const invitee = uniqueEmail("demoted");
    await (await kerf.signedIn(coOwner)).send("post", `/api/channels/${world.channel.id}/invitations`, { email: invitee, role: "crew" }).expect(201);

    const owner = await kerf.signedIn(world.owner);
    await owner.send("patch", `/api/channels/${world.channel.id}/members/${world.producer.id}`, { role: "editor" }).expect(200);
    await owner.send("patch", `/api/channels/${world.channel.id}/members/${coOwner.id}`, { role: "producer" }).expect(200);

    await kerf.startMailWorker();
    const jobs = await settledJobs(kerf.database.pool, "mail", anyJob, 2);
    expect(jobs.map((job) => job.output)).toEqual([
      { outcome: "skipped", reason: "the recipient's role no longer allows it" },
      // Losing the owner's role withdrew the invitation.
      { outcome: "skipped", reason: "the invitation is no longer open" },
    ]);
    expect(await mailTo(world.producer.email)).toEqual([]);
    expect(await mailTo(invitee)).toEqual([]);
    expect((await owner.get(`/api/channels/${world.channel.id}/members`).expect(200)).body.invitations).toEqual([]);
  });

  it("when the owner who sent invitations is removed, then their links are withdrawn and a mail still queued is not sent", async () => {
    const kerf = await app({ holdMail: true });
    const world = await createCrewedChannel(kerf.db, "Two Owners");
    const coOwner = await createUser(kerf.db, { name: "Cleo Coowner" });
    await addMember(kerf.db, world.channel.id, coOwner, "owner");
    const mailed = await createInvitation(kerf.db, { channelId: world.channel.id, invitedBy: coOwner, role: "crew" });
    const queued = uniqueEmail("queued");
    await (await kerf.signedIn(coOwner)).send("post", `/api/channels/${world.channel.id}/invitations`, { email: queued, role: "editor" }).expect(201);
    await removeMember(kerf, world.owner, world.channel.id, coOwner.id);

    await kerf.startMailWorker();
    const [job] = await settledJobs(kerf.database.pool, "mail", anyJob, 1);
    expect(await mailTo(queued)).toEqual([]);
    expect(job!.output).toMatchObject({ outcome: "skipped" });
    const refused = await (await kerf.visitor()).send("post", `/api/invitations/${mailed.token}/accept`, { name: "Late Comer", password: "a-long-enough-password" }).expect(410);
    expect(refused.body.error.message).toMatch(/withdrawn/);
    const members = await (await kerf.signedIn(world.owner)).get(`/api/channels/${world.channel.id}/members`).expect(200);
    expect(members.body.invitations).toEqual([]);
  });

  it("when a sponsor decides on a link whose sender has left, then the decision stands and the channel's owners and producers are told instead", async () => {
    const kerf = await app();
    const world = await createCrewedChannel(kerf.db, "Left Behind");
    const secondProducer = await createUser(kerf.db, { name: "Pia Second" });
    await addMember(kerf.db, world.channel.id, secondProducer, "producer");
    const episode = await createEpisode(kerf.db, world.channel.id, { title: "Torque test", targetPublishDate: "2027-08-01" });
    const sponsor = await createSponsor(kerf.db, world.channel.id, { company: "Ridge Drivers" });
    const contact = await createContact(kerf.db, world.channel.id, sponsor.id, { name: "Ines Rye", email: uniqueEmail("ines") });
    const deal = await createDeal(kerf.db, world.channel.id, episode.id, { sponsorId: sponsor.id, contactId: contact.id, publishDate: "2027-08-01" });
    const item = deal.items.find((i) => i.kind === "script_approval")!;
    const sent = await (await kerf.signedIn(world.producer))
      .send("post", `/api/channels/${world.channel.id}/deals/${deal.deal.id}/review-links`, { deliverableId: item.id, contactId: contact.id })
      .expect(201);
    await waitForMail(contact.email);
    await removeMember(kerf, world.owner, world.channel.id, world.producer.id);

    const token = (sent.body.url as string).split("/review/")[1]!;
    const contactVisitor = await kerf.visitor();
    await contactVisitor.get(`/api/review/${token}`).expect(200);
    const { seen } = (await contactVisitor.get(`/api/review/${token}`).expect(200)).body;
    await contactVisitor.send("post", `/api/review/${token}/decision`, { decision: "approved", comment: "Looks right.\nShip it.", seen }).expect(200);

    for (const person of [world.owner, secondProducer]) {
      const mail = await waitForMail(person.email);
      expect(mail.subject).toBe('Ines Rye of Ridge Drivers approved "Sponsor approves the script"');
      expect(mail.text).toContain("> Looks right.\n> Ship it.");
      expect(mail.text).toContain("Pim Producer, who sent the review link, is no longer in the channel");
    }
    // The link's mail, the decision (passed on) and one mail to each of the two.
    await settledJobs(kerf.database.pool, "mail", anyJob, 4);
    expect(await mailTo(world.producer.email)).toEqual([]);
    expect(await mailTo(world.editor.email)).toEqual([]);
  });
});
