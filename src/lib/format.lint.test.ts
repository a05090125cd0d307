import { ESLint } from "eslint";
import { describe, expect, it } from "vitest";

// The rule in eslint.config.js that keeps one way of writing dates: every other way of formatting a
// date (or money) in the client is refused, src/lib/format.ts alone may, and the client as it stands
// passes. Runs the project's own lint configuration from the repository root.
const ours = ({ ruleId }: { ruleId: string }) => ruleId === "no-restricted-properties" || ruleId === "no-restricted-syntax";
const eslint = new ESLint({ ruleFilter: ours });
const featureFile = "src/features/slate/components/Example.tsx";
const formatOnce = /src\/lib\/format\.ts/;

async function problemsIn(code: string, filePath = featureFile): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return (result?.messages ?? []).map((m) => m.message);
}

describe("only one date format function is used by the client", () => {
  it.each([
    ["a date's toLocaleDateString", "export const a = (at: string) => new Date(at).toLocaleDateString();"],
    ["a date's toLocaleTimeString", "export const a = (at: Date) => at.toLocaleTimeString();"],
    ["a date's toLocaleString", "export const a = (at: string) => new Date(at).toLocaleString(undefined, { dateStyle: 'medium' });"],
    ["a date's toDateString", "export const a = (at: Date) => at.toDateString();"],
    ["Intl.DateTimeFormat", "export const a = new Intl.DateTimeFormat('en-GB', { dateStyle: 'long' });"],
    ["Intl.RelativeTimeFormat", "export const a = new Intl.RelativeTimeFormat('en').format(-1, 'day');"],
    ["Intl.NumberFormat for money", "export const a = new Intl.NumberFormat(undefined, { style: 'currency', currency: 'EUR' });"],
    ["date-fns' format", "import { format } from 'date-fns';\nexport const a = format(new Date(), 'yyyy');"],
    ["date-fns' format under another name", "import { format as write } from 'date-fns/format';\nexport const a = write(new Date(), 'yyyy');"],
    ["all of date-fns at once", "import * as dates from 'date-fns';\nexport const a = dates.format(new Date(), 'yyyy');"],
    ["a formatter of shared/ instead of the client's", "import { formatBytes } from '@shared/rushes/limits';\nexport const a = formatBytes(1);"],
    ["the shared date module instead of the client's", "import { formatInstant } from '@shared/fields/written-dates';\nexport const a = formatInstant(new Date(), 'UTC');"],
  ])("refuses %s outside src/lib/format.ts", async (_what, code) => {
    const problems = await problemsIn(code);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(formatOnce);
  });

  it("lets src/lib/format.ts itself use Intl.DateTimeFormat", async () => {
    expect(await problemsIn("export const a = new Intl.DateTimeFormat('en-GB');", "src/lib/format.ts")).toEqual([]);
  });

  it("leaves the format module's own functions and plain string methods alone", async () => {
    const code = "import { formatDay, formatInstant } from '../../../lib/format';\nexport const a = (tz: string) => `${formatDay('2027-03-05')} ${formatInstant('2027-03-05T10:00:00Z', tz)} ${'Mass'.toLocaleLowerCase()}`;";
    expect(await problemsIn(code)).toEqual([]);
  });

  it("finds no other way of formatting a date anywhere in src/ today", async () => {
    const results = await eslint.lintFiles(["src"]);
    const found = results.flatMap((r) => r.messages.filter((m) => formatOnce.test(m.message)).map((m) => `${r.filePath}:${m.line} ${m.message}`));
    expect(found).toEqual([]);
    // Parsing every file of src/ takes a while on a busy machine.
  }, 120_000);
});
