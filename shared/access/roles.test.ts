import { describe, expect, it } from "vitest";
import { roleMay, rolesAllowed } from "./roles";

// Expected cells are copied from the role table in the product spec ("People and roles").
describe("role grants", () => {
  it("lets only the owner change members, and the producer read them", () => {
    expect(rolesAllowed("members", "W")).toEqual(["owner"]);
    expect(rolesAllowed("members", "R")).toEqual(["owner", "producer"]);
  });

  it("lets crew read episodes but not change them", () => {
    expect(roleMay("crew", "episodes", "R")).toBe(true);
    expect(roleMay("crew", "episodes", "W")).toBe(false);
  });

  it("never shows fees to editor or crew", () => {
    expect(rolesAllowed("fees", "R")).toEqual(["owner", "producer"]);
  });

  it("shows costs and income of episodes to owner and producer only (spec: \"costs and income of episodes\")", () => {
    expect(rolesAllowed("money", "R")).toEqual(["owner", "producer"]);
    expect(rolesAllowed("money", "W")).toEqual(["owner", "producer"]);
  });

  it("lets everyone write comments", () => {
    expect(rolesAllowed("comments", "W")).toEqual(["owner", "producer", "editor", "crew"]);
  });

  it("lets the editor deliver the cut but not run the other deliverables (spec: deliverables, editor \"R (W on the cut items they deliver)\")", () => {
    expect(rolesAllowed("cut", "W")).toEqual(["owner", "producer", "editor"]);
    expect(rolesAllowed("deliverables", "W")).toEqual(["owner", "producer"]);
    expect(roleMay("crew", "cut", "R")).toBe(true);
  });

  it("lets crew upload and log footage but not delete it (spec: footage, crew \"W (upload and log; no delete)\")", () => {
    expect(rolesAllowed("footage", "W")).toEqual(["owner", "producer", "editor", "crew"]);
    expect(rolesAllowed("footageRemoval", "W")).toEqual(["owner", "producer", "editor"]);
  });

  it("gives every role that writes deliverables the cut too, so the cut's grant is the wider of the two", () => {
    for (const role of rolesAllowed("deliverables", "W")) expect(roleMay(role, "cut", "W")).toBe(true);
  });
});
