import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { allRecipes, fillPath, makeAccessWorld } from "../support/access-world";
import { rowsSnapshot } from "../support/rows-snapshot";
import { startTestApp, type TestApp } from "../support/test-app";
import type { AccessWorld, Recipe } from "./access/matrix";
import { sampleMetadata } from "./rushes-helpers";

/*
 * Finding: sponsor dates had no year bounds; 9999-12-31 overflowed derived dates after the row was
 * committed. Every date a request carries now passes one rule (shared/fields/dates.ts): a real
 * calendar date in 2000–2100 (a clip's recorded time: 1900–2100). Each route below is sent its valid
 * body with one date made extreme: it answers 400 naming the field and changes no row.
 */
const C = "/api/channels/:channelId";
type Body = Record<string, unknown>;

const extremeDates = ["9999-12-31", "0000-01-01", "1999-12-31", "2101-01-01"];
/** A clip's recorded time may be as old as 1900 (archive footage, cameras whose clock was never set). */
const extremeInstants = ["9999-12-31", "0000-01-01", "1899-12-31", "2101-01-02"];

/** Where each route carries a date, and how to put one there in an otherwise valid body. */
const dateCarriers: Record<string, { field: string; put: (body: Body, date: string) => Body; extremes?: string[] }[]> = {
  [`POST ${C}/episodes`]: [{ field: "targetPublishDate", put: (b, d) => ({ ...b, targetPublishDate: d }) }],
  [`PATCH ${C}/episodes/:episodeId`]: [{ field: "targetPublishDate", put: (b, d) => ({ ...b, targetPublishDate: d }) }],
  [`PUT ${C}/episodes/:episodeId/due-dates/:stage`]: [{ field: "dueDate", put: (b, d) => ({ ...b, dueDate: d }) }],
  [`POST ${C}/episodes/:episodeId/shoot-days`]: [{ field: "day", put: (b, d) => ({ ...b, day: d }) }],
  [`PATCH ${C}/shoot-days/:shootDayId`]: [{ field: "day", put: (b, d) => ({ ...b, day: d }) }],
  [`POST ${C}/deals`]: [
    { field: "goLiveDate", put: (b, d) => ({ ...b, goLiveDate: d }) },
    { field: "money.invoicedOn", put: (b, d) => ({ ...b, money: { ...(b.money as Body), invoicedOn: d } }) },
    { field: "money.paidOn", put: (b, d) => ({ ...b, money: { ...(b.money as Body), paidOn: d } }) },
  ],
  [`PATCH ${C}/deals/:dealId`]: [{ field: "goLiveDate", put: (b, d) => ({ ...b, goLiveDate: d }) }],
  [`PUT ${C}/deals/:dealId/money`]: [
    { field: "invoicedOn", put: (b, d) => ({ ...b, invoicedOn: d }) },
    { field: "paidOn", put: (b, d) => ({ ...b, paidOn: d }) },
  ],
  [`POST ${C}/deals/:dealId/deliverables`]: [{ field: "fixedDate", put: (b, d) => ({ ...b, anchor: "fixed", fixedDate: d }) }],
  [`PATCH ${C}/deliverables/:deliverableId`]: [{ field: "fixedDate", put: (b, d) => ({ ...b, anchor: "fixed", fixedDate: d }) }],
  [`POST ${C}/uploads`]: [{ field: "metadata.recordedAt", put: (b, d) => ({ ...b, metadata: { ...sampleMetadata, recordedAt: `${d}T10:00:00Z` } }), extremes: extremeInstants }],
  [`POST ${C}/uploads/:uploadId/complete`]: [{ field: "metadata.recordedAt", put: (b, d) => ({ ...b, metadata: { ...sampleMetadata, recordedAt: `${d}T10:00:00Z` } }), extremes: extremeInstants }],
};


let app: TestApp;
let world: AccessWorld;
let recipes: Record<string, Recipe>;
beforeAll(async () => {
  app = await startTestApp();
  world = await makeAccessWorld(app);
  recipes = allRecipes(app, world);
});
afterAll(() => app.close());

describe("dates out of range", () => {
  it.each(Object.keys(dateCarriers))("when %s gets an extreme date, then it answers 400 on that field and changes nothing", async (route) => {
    const recipe = recipes[route];
    expect(recipe, `no access-matrix recipe for ${route}`).toBeDefined();
    const [method, template] = route.split(" ") as [string, string];
    const agent = await app.signedIn(world.people.owner);
    for (const carrier of dateCarriers[route]!) {
      for (const date of carrier.extremes ?? extremeDates) {
        const prepared = (await recipe!.prepare?.({ caller: "owner", person: world.people.owner })) ?? {};
        const path = fillPath(template, { channelId: world.channel.id, ...prepared.params });
        const before = await rowsSnapshot(app);
        const response = await agent.send(method.toLowerCase() as "post", path, carrier.put((prepared.body ?? {}) as Body, date));
        const seen = `${route} with ${carrier.field} = ${date}: ${response.status} ${JSON.stringify(response.body)}`;
        expect(response.status, seen).toBe(400);
        expect(response.body.error.fields, seen).toHaveProperty([carrier.field]);
        expect(await rowsSnapshot(app), seen).toBe(before);
      }
    }
  });
});
