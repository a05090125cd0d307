import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { RoleTable } from "./RoleTable";

// The members page reads the same grants the server checks (shared/access/roles.ts).
describe("the role table on the members page", () => {
  const html = renderToStaticMarkup(<RoleTable />);

  it("says crew may upload footage but not delete it", () => {
    expect(html).toContain("Crew may change</span>");
    const deleting = html.slice(html.indexOf("Deleting footage"), html.indexOf("</tr>", html.indexOf("Deleting footage")));
    expect(deleting).toContain("Crew no access");
    expect(deleting).toContain("Editor may change");
  });

  it("keeps fees to owners and producers", () => {
    const fees = html.slice(html.indexOf("Fees, payment terms"), html.indexOf("</tr>", html.indexOf("Fees, payment terms")));
    expect(fees).toContain("Owner may change");
    expect(fees).toContain("Producer may change");
    expect(fees).toContain("Editor no access");
    expect(fees).toContain("Crew no access");
  });

  it("lets crew check a hazard at power-on, though the hazard list stays the test plan's", () => {
    const row = (label: string) => html.slice(html.indexOf(label), html.indexOf("</tr>", html.indexOf(label)));
    expect(row("Checking a hazard before power-on")).toContain("Crew may change");
    expect(row("Checking a hazard before power-on")).toContain("Editor may read");
    expect(row("Test plan and its hazard list")).toContain("Crew may read");
  });
});
