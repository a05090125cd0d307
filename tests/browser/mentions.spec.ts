import { expect, test } from "@playwright/test";
import { hostWithEpisode, member, snap } from "./support";

test("typing @ and part of a name suggests members; arrows and Enter pick one, and the comment mentions them", async ({ page }) => {
  const { channelId, episodeId } = await hostWithEpisode(page, {
    host: { name: "Marit Oyelaran", channel: "Tidewater Bench" },
    episode: { title: "Solar still from a cold frame", question: "Can it make a litre a day?", origin: "idea", stage: "build" },
  });
  await member(channelId, "Kofi Lindahl", "editor");
  await member(channelId, "Kofi Adeyemi", "crew");
  await page.goto(`/c/${channelId}/episodes/${episodeId}/comments`);

  const box = page.getByLabel("Add a comment");
  await box.fill("Footage check, @ko");
  const list = page.getByRole("listbox", { name: "Members to mention" });
  await expect(list.getByRole("option")).toHaveText(["@Kofi Adeyemi", "@Kofi Lindahl"]);
  await expect(list.getByRole("option", { name: "@Kofi Adeyemi" })).toHaveAttribute("aria-selected", "true");
  await snap(page, "mentions-01-suggestions");

  await box.press("ArrowDown");
  await expect(list.getByRole("option", { name: "@Kofi Lindahl" })).toHaveAttribute("aria-selected", "true");
  await box.press("Enter");
  await expect(box).toHaveValue("Footage check, @Kofi Lindahl ");
  await expect(list).toHaveCount(0);

  // Escape closes the list without choosing; typing goes on as written.
  await box.pressSequentially("and @Ko");
  await expect(list).toBeVisible();
  await box.press("Escape");
  await expect(list).toHaveCount(0);
  await box.pressSequentially("fi Adeyemi please");

  await page.getByRole("button", { name: "Post comment" }).click();
  await expect(page.getByText("Posted. Kofi Lindahl, Kofi Adeyemi will get an e-mail.")).toBeVisible();
});
