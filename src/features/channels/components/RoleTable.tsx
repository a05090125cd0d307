import { areas, grants, roleLabels, roles, type Area, type Grant } from "@shared/access/roles";

/** The role table in the product's words: the same grants the server checks on every request. */
const areaLabels: Record<Area, string> = {
  members: "Members and invitations",
  episodes: "Episodes and the board",
  comments: "Comments",
  testPlan: "Test plan and its hazard list",
  safetyChecks: "Checking a hazard before power-on",
  bench: "Bench runs, shelf and build log",
  shoot: "Shoot days and shot lists",
  footage: "Uploading and logging footage",
  footageRemoval: "Deleting footage",
  sponsors: "Sponsors and deals",
  fees: "Fees, payment terms and invoices",
  deliverables: "Sponsor items",
  cut: "The cut of a sponsor's segment",
  publish: "Publishing",
  money: "Costs, income and margins of episodes",
  intake: "Viewers' suggestions: entering, grouping, weighing",
  intakePage: "The public suggestion page and comment imports",
};

const grantWords: Record<Grant, string> = { W: "changes", R: "reads", "-": "—" };
const grantSpoken: Record<Grant, string> = { W: "may change", R: "may read", "-": "no access" };

export function RoleTable() {
  return (
    <details className="mt-8 rounded-lg border border-ply-300 bg-white p-4">
      <summary className="cursor-pointer font-semibold">What each role may do</summary>
      <table className="mt-3 w-full table-fixed text-left text-sm">
        <caption className="mb-2 text-left text-xs text-graphite-500">Kerf checks these on every request; a change of role applies at once.</caption>
        <thead className="border-b border-ply-300 text-xs uppercase tracking-wide text-graphite-500">
          <tr>
            <th scope="col" className="w-2/5 py-2 pr-2 font-semibold">
              Area
            </th>
            {roles.map((role) => (
              <th key={role} scope="col" className="py-2 pr-1 font-semibold">
                {roleLabels[role]}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {areas.map((area) => (
            <tr key={area} className="border-b border-ply-200 align-top">
              <th scope="row" className="py-2 pr-2 font-medium break-words">
                {areaLabels[area]}
              </th>
              {roles.map((role) => {
                const grant = grants[area][role];
                return (
                  <td key={role} className={`py-2 pr-1 ${grant === "W" ? "font-semibold" : "text-graphite-500"}`}>
                    <span aria-hidden>{grantWords[grant]}</span>
                    <span className="sr-only">{`${roleLabels[role]} ${grantSpoken[grant]}`}</span>
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </details>
  );
}
