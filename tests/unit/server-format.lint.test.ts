import { ESLint } from "eslint";
import { describe, expect, it } from "vitest";

// The rule in eslint.config.js that keeps one way of writing dates and times on the server: mails and
// board flags write them through shared/fields/written-dates.ts (the module src/lib/format.ts hands the
// client), in the reader's zone, never with a Date's own methods or another formatter. Runs the
// project's own lint configuration from the repository root.
const ours = ({ ruleId }: { ruleId: string }) => ruleId === "no-restricted-properties" || ruleId === "no-restricted-syntax";
const eslint = new ESLint({ ruleFilter: ours });
const serverFile = "server/sponsors/example.ts";
const writtenOnce = /shared\/fields\/written-dates\.ts/;

async function problemsIn(code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: serverFile });
  return (result?.messages ?? []).map((m) => m.message);
}

describe("only one date format function is used by the server", () => {
  it.each([
    ["a date's toUTCString", "export const a = (at: Date) => `expires on ${at.toUTCString()}`;"],
    ["a date's toLocaleDateString", "export const a = (at: Date) => at.toLocaleDateString('en-GB');"],
    ["a date's toLocaleTimeString", "export const a = (at: Date) => at.toLocaleTimeString();"],
    ["a date's toDateString", "export const a = (at: Date) => at.toDateString();"],
    ["Intl.DateTimeFormat", "export const a = new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC' });"],
    ["date-fns' format", "import { format } from 'date-fns';\nexport const a = format(new Date(), 'EEE d MMM');"],
    ["all of date-fns at once", "import * as dates from 'date-fns';\nexport const a = dates.format(new Date(), 'yyyy');"],
  ])("refuses %s in server/", async (_what, code) => {
    const problems = await problemsIn(code);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(writtenOnce);
  });

  it("lets the server write times through the shared module, and use date-fns' arithmetic", async () => {
    const code = "import { addDays } from 'date-fns';\nimport { formatInstantNamingZone } from '../../shared/fields/written-dates';\nexport const a = (tz: string) => formatInstantNamingZone(addDays(new Date(), 7), tz);";
    expect(await problemsIn(code)).toEqual([]);
  });

  it("finds no other way of writing a date anywhere in server/ today", async () => {
    const results = await eslint.lintFiles(["server"]);
    const found = results.flatMap((r) => r.messages.filter((m) => writtenOnce.test(m.message)).map((m) => `${r.filePath}:${m.line} ${m.message}`));
    expect(found).toEqual([]);
    // Parsing every file of server/ takes a while on a busy machine.
  }, 120_000);
});
