import { formatMinorMoney } from "../../../lib/format";

/** A margin with its sign written out: "+€120.00", "−€40.00". */
export const signedMoney = (minor: number, currency: string) => `${minor < 0 ? "−" : "+"}${formatMinorMoney(Math.abs(minor), currency)}`;

export function Figure({ label, value, tone, testId }: { label: string; value: string; tone?: "good" | "bad"; testId?: string }) {
  const colour = tone === "bad" ? "text-alarm-600" : tone === "good" ? "text-moss-600" : "text-graphite-900";
  return (
    <div className="min-w-0">
      <dt className="text-xs text-graphite-500">{label}</dt>
      <dd className={`text-lg font-semibold break-words ${colour}`} data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}
