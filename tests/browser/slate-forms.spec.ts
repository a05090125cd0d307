import { expect, test, type Page } from "@playwright/test";
import { snap, signUpThroughApi, uniqueEmail } from "./support";

const TITLE = "Ducted fan against open rotor";

/** The scripts a page fetches from now on, with whether each holds zod's core (its `$ZodType` class name). */
function scriptsFetched(page: Page): () => Promise<{ url: string; zod: boolean }[]> {
  const seen: Promise<{ url: string; zod: boolean }>[] = [];
  page.on("response", (response) => {
    if (response.request().resourceType() === "script") seen.push(response.text().then((text) => ({ url: response.url(), zod: text.includes("$ZodType") })));
  });
  return () => Promise.all(seen);
}

test("the slate and the episode page show without zod; their forms fetch it when used, by keyboard", async ({ page }) => {
  const { channelId } = await signUpThroughApi(page, { name: "Ines Varga", email: uniqueEmail("slate-forms"), channel: "Pond Street Bench" });

  // A first load of the slate: the board and its buttons, no form code.
  const slateScripts = scriptsFetched(page);
  await page.goto(`/c/${channelId}/slate`);
  await expect(page.getByRole("heading", { name: "Slate" })).toBeVisible();
  await expect(page.getByText("No episodes yet")).toBeVisible();
  expect((await slateScripts()).filter((script) => script.zod)).toEqual([]);

  // The form comes when its dialog opens, the focus on its first field; its checks work as before.
  await page.getByRole("button", { name: "New episode" }).focus();
  await page.keyboard.press("Enter");
  await expect(page.getByLabel("Working title")).toBeFocused();
  await page.getByRole("button", { name: "Create episode" }).click();
  await expect(page.getByText("Give the episode a working title.")).toBeVisible();
  // What the first load lacked came with the form: the check above does see zod when it is fetched.
  expect((await slateScripts()).some((script) => script.zod)).toBe(true);
  await page.getByLabel("Working title").fill(TITLE);
  await page.getByRole("button", { name: "Create episode" }).click();
  await expect(page.getByRole("heading", { name: TITLE })).toBeVisible();
  const episodeAddress = page.url();

  // A filter in the address is read once its schema has come; one picked from the bar keeps the focus.
  await page.goto(episodeAddress.replace(/\/episodes\/.*$/, "/slate?risk=1"));
  await expect(page.getByText("No episodes match these filters")).toBeVisible();
  await page.getByLabel("At risk only").focus();
  await page.keyboard.press("Space");
  await expect(page.getByRole("link", { name: TITLE })).toBeVisible();
  await expect(page.getByLabel("At risk only")).toBeFocused();
  await expect(page.getByLabel("At risk only")).not.toBeChecked();

  // A first load of the episode page, open on its overview: no zod either.
  const episodeScripts = scriptsFetched(page);
  await page.goto(episodeAddress);
  await expect(page.getByRole("heading", { name: TITLE })).toBeVisible();
  await expect(page.getByRole("heading", { name: "Overview and dates" })).toBeVisible();
  expect((await episodeScripts()).filter((script) => script.zod)).toEqual([]);

  // Moving past missing essentials asks for a reason, checked by the move's own rule.
  await page.getByLabel("Move to stage").selectOption({ label: "Build" });
  await page.getByRole("button", { name: "Move", exact: true }).click();
  const gate = page.getByRole("dialog", { name: `Move “${TITLE}” to Build?` });
  await expect(gate).toBeVisible();
  await gate.getByRole("button", { name: "Move it on" }).click();
  await expect(gate.getByText("Say in a few words why it moves on anyway.")).toBeVisible();
  await gate.getByLabel("Why move it on anyway? (kept in the history)").fill("The rig is borrowed for one week only.");
  await gate.getByRole("button", { name: "Move it on" }).click();
  await expect(page.getByText("Moved to Build.")).toBeVisible();
  await snap(page, "slate-forms-moved-past-gate");
});
