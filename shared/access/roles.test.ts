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

  it("lets everyone write comments", () => {
    expect(rolesAllowed("comments", "W")).toEqual(["owner", "producer", "editor", "crew"]);
  });
});
