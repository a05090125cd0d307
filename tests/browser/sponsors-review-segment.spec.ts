import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { expect, test, type APIRequestContext, type Locator } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { hostWithEpisode, member, signIn, snap, uniqueEmail } from "./support";

test.setTimeout(180_000);

// A 6 s H.264 file at 25 fps with a tone, made with Debian's ffmpeg when the test runs:
//   ffmpeg -f lavfi -i testsrc=size=320x240:rate=25 -f lavfi -i sine -t 6 -c:v libx264 -pix_fmt yuv420p -c:a aac -movflags +faststart cut.mp4
function makeCutFile(): { bytes: Buffer; done: () => void } {
  const folder = mkdtempSync(path.join(tmpdir(), "kerf-cut-"));
  const file = path.join(folder, "sponsor-read.mp4");
  execFileSync("ffmpeg", ["-v", "error", "-y", "-f", "lavfi", "-i", "testsrc=size=320x240:rate=25", "-f", "lavfi", "-i", "sine", "-t", "6", "-c:v", "libx264", "-pix_fmt", "yuv420p", "-c:a", "aac", "-movflags", "+faststart", file]);
  return { bytes: readFileSync(file), done: () => rmSync(folder, { recursive: true, force: true }) };
}

/** A call that must succeed: the journey starts only on a setup the product itself would make. */
async function call(request: APIRequestContext, method: "post" | "put", url: string, headers: Record<string, string>, data: object, status: number) {
  const answer = await request[method](url, { headers, data });
  expect(answer.status(), `${method.toUpperCase()} ${url}: ${await answer.text()}`).toBe(status);
  return answer.json();
}

/** The file goes to storage as the footage uploader sends it: presigned parts, each reported, then completed. */
async function uploadCut(request: APIRequestContext, base: string, headers: Record<string, string>, episodeId: string, bytes: Buffer) {
  const metadata = { durationMs: 6000, frameRate: { numerator: 25, denominator: 1 }, dropFrame: false, width: 320, height: 240, codec: "AVC", startTimecode: null, recordedAt: null, camera: "" };
  const { upload } = await call(request, "post", `${base}/uploads`, headers, { episodeId, fileName: "sponsor-read.mp4", size: bytes.length, metadata }, 201);
  for (let partNumber = 1; partNumber <= upload.partCount; partNumber++) {
    const start = (partNumber - 1) * upload.partSize;
    const size = Math.min(upload.partSize, bytes.length - start);
    const { urls } = await call(request, "post", `${base}/uploads/${upload.id}/part-urls`, headers, { parts: [{ partNumber, size }] }, 200);
    const put = await request.put(urls[0].url, { data: bytes.subarray(urls[0].start, urls[0].end) });
    expect(put.status(), "storage took the part").toBe(200);
    await call(request, "post", `${base}/uploads/${upload.id}/parts`, headers, { parts: [{ partNumber, etag: put.headers()["etag"]!, size }] }, 200);
  }
  const { clip } = await call(request, "post", `${base}/uploads/${upload.id}/complete`, headers, {}, 201);
  return clip.id as string;
}

const fileTime = (player: Locator) => player.locator("video").evaluate((v: HTMLVideoElement) => v.currentTime);

test("the sponsor's review page plays the segment from its in point and stops at its out point", async ({ page, browser }) => {
  const cut = makeCutFile();
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Brigit Aalto", channel: "Sawdust Signal" },
    episode: { title: "A fence for the bandsaw", question: "Can a shop-made fence hold 0.1 mm over 300 mm?", origin: "sponsor", stage: "edit" },
  });
  const headers = { "x-csrf-token": csrfToken };
  const base = `/api/channels/${channelId}`;
  const { sponsor } = await call(page.request, "post", `${base}/sponsors`, headers, { company: "Kestrel Blades", website: null, notes: null }, 201);
  const { contact } = await call(page.request, "post", `${base}/sponsors/${sponsor.id}/contacts`, headers, { name: "Ada Voss", email: uniqueEmail("ada"), role: null }, 201);
  const { deal } = await call(
    page.request,
    "post",
    `${base}/deals`,
    headers,
    {
      episodeId,
      sponsorId: sponsor.id,
      templateId: null,
      state: "signed",
      placement: "middle",
      segmentSeconds: 5,
      talkingPoints: [],
      link: null,
      promoCode: null,
      disclosureText: null,
      exclusivityNotes: null,
      descriptionCopy: null,
      script: "This video is sponsored by Kestrel Blades.",
      contactId: contact.id,
      hostId: null,
      goLiveDate: null,
      money: { fee: 900, currency: "EUR", paymentTermsDays: 30, paymentTermsFrom: "invoice", invoiceNumber: null, invoicedOn: null, paidOn: null },
    },
    201,
  );
  const withItem = await call(page.request, "post", `${base}/deals/${deal.id}/deliverables`, headers, { kind: "final_approval", title: "Sponsor approves the cut", anchor: "fixed", fixedDate: "2027-03-01" }, 201);
  const item = withItem.deal.deliverables.find((d: { kind: string }) => d.kind === "final_approval");
  const clipId = await uploadCut(page.request, base, headers, episodeId, cut.bytes);
  cut.done();
  // The segment is 2 s to 4 s of the file: frames 50 to 100 at the clip's 25 fps.
  const timing = { inTimecode: "00:00:02:00", outTimecode: "00:00:04:00", frameRate: "25", dropFrame: false };
  await call(page.request, "put", `${base}/deals/${deal.id}/cut`, headers, { clipId, timing, version: withItem.deal.version }, 200);
  const sent = await call(page.request, "post", `${base}/deals/${deal.id}/review-links`, headers, { deliverableId: item.id, contactId: contact.id, expiresInDays: 7 }, 201);

  // The sponsor opens the link, signed out.
  const sponsorPage = await (await browser.newContext()).newPage();
  await sponsorPage.goto(new URL(sent.url).pathname);
  const player = sponsorPage.getByRole("group", { name: "Segment player" });
  await expect(player).toHaveAttribute("data-state", "ready", { timeout: 20_000 });
  await expect(player.getByRole("status")).toHaveText("Ready at the segment's start");
  await expect.poll(() => fileTime(player)).toBeCloseTo(2, 1);
  await expect(sponsorPage.getByText("The segment runs 2 s; the contract asks for 5 s (3 s short).")).toBeVisible();
  await expect(player).toContainText("0:00.0 / 0:02.0");
  await snap(sponsorPage, "review-segment-01-ready");

  // Play: it runs from the in point and stops at the out point by itself.
  await player.getByRole("button", { name: "Play" }).click();
  await expect(player).toHaveAttribute("data-state", "ended", { timeout: 20_000 });
  await expect(player.getByRole("status")).toHaveText("Stopped at the segment's end");
  const stoppedAt = await fileTime(player);
  expect(stoppedAt).toBeGreaterThanOrEqual(3.95);
  expect(stoppedAt).toBeLessThanOrEqual(4.05);
  expect(await player.locator("video").evaluate((v: HTMLVideoElement) => v.paused)).toBe(true);
  await expect(player).toContainText("0:02.0 / 0:02.0");
  await snap(sponsorPage, "review-segment-02-stopped");

  // A seek outside the segment lands back inside it, whichever way it comes.
  await player.locator("video").evaluate((v: HTMLVideoElement) => (v.currentTime = 5.5));
  await expect.poll(() => fileTime(player)).toBeCloseTo(4, 1);
  await player.locator("video").evaluate((v: HTMLVideoElement) => (v.currentTime = 0.2));
  await expect.poll(() => fileTime(player)).toBeCloseTo(2, 1);

  // The scrubber spans the segment only; a comment pins to where it stands.
  const scrubber = player.getByRole("slider", { name: "Moment in the segment" });
  await scrubber.focus();
  await sponsorPage.keyboard.press("End");
  await expect(player).toHaveAttribute("data-state", "ended");
  await sponsorPage.keyboard.press("Home");
  await expect(player).toHaveAttribute("data-state", "ready");
  await scrubber.fill("1");
  await expect(player).toHaveAttribute("data-offset", "1.00");
  await expect.poll(() => fileTime(player)).toBeCloseTo(3, 1);
  const comment = sponsorPage.getByRole("form", { name: "Comment on a moment" });
  await comment.getByLabel("Comment on this moment").fill("Show the blade guard here");
  await comment.getByRole("button", { name: "Pin comment here" }).click();
  await expect(comment.getByText("Pinned at 0:01.0.")).toBeVisible();
  const pinned = sponsorPage.getByRole("list", { name: "Your pinned comments" });
  await expect(pinned.getByRole("listitem")).toHaveText(["0:01.0Show the blade guard here"]);
  await expectNoSeriousA11yViolations(sponsorPage, "sponsor review of the segment");
  await snap(sponsorPage, "review-segment-03-pinned");
  await sponsorPage.setViewportSize({ width: 390, height: 844 });
  expect(await sponsorPage.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await snap(sponsorPage, "review-segment-04-phone");

  // The editor sees the pin at the clip's timecode, and jumps to it: 2 s + 1 s = frame 75 at 25 fps, 00:00:03:00.
  const editorPerson = await member(channelId, "Jonas Ek", "editor");
  const editor = await signIn(browser, editorPerson.email);
  await editor.goto(`/c/${channelId}/episodes/${episodeId}/sponsor-deals`);
  const pins = editor.getByRole("region", { name: "Sponsor's pinned comments" });
  await expect(pins).toContainText("Show the blade guard here");
  await expect(pins).toContainText("Ada Voss · Sponsor approves the cut");
  await expect(editor.getByRole("form", { name: "The cut" })).toContainText("Frame rate 25 fps, from the clip");
  await pins.getByRole("button", { name: "Play from 00:00:03:00" }).click();
  const cutPlayer = editor.getByRole("group", { name: "Cut player" });
  await expect(cutPlayer).toHaveAttribute("data-state", "paused", { timeout: 20_000 });
  await expect.poll(() => fileTime(cutPlayer)).toBeCloseTo(3, 1);
  await snap(editor, "review-segment-05-editor-pins");
});
