import { describe, expect, it } from "vitest";
import { playerKeys } from "./player-keys";

const press = (key: string, mods: Partial<Record<"shiftKey" | "altKey" | "ctrlKey" | "metaKey", boolean>> = {}) => ({ key, shiftKey: false, altKey: false, ctrlKey: false, metaKey: false, ...mods });
const actionOf = (event: ReturnType<typeof press>) => playerKeys.filter((k) => k.matches(event)).map((k) => k.action);

describe("the player's keys", () => {
  it("when a key is pressed, then at most one action answers it", () => {
    for (const event of [press(" "), press("ArrowLeft"), press("ArrowLeft", { shiftKey: true }), press("i"), press("I", { shiftKey: true }), press("o"), press("n"), press("?", { shiftKey: true })]) {
      expect(actionOf(event).length, event.key).toBeLessThanOrEqual(1);
    }
  });

  it("when in, out and note are pressed with or without caps, then they set in, out and open the note", () => {
    expect(actionOf(press("i"))).toEqual(["in"]);
    expect(actionOf(press("O", { shiftKey: true }))).toEqual(["out"]);
    expect(actionOf(press("n"))).toEqual(["note"]);
    expect(actionOf(press("ArrowRight", { shiftKey: true }))).toEqual(["secondOn"]);
  });

  it("when the browser's own shortcuts are pressed (Ctrl or Cmd with a letter), then the player leaves them alone", () => {
    expect(actionOf(press("i", { ctrlKey: true }))).toEqual([]);
    expect(actionOf(press("o", { metaKey: true }))).toEqual([]);
  });

  it("when the sheet lists the keys, then every action is there once with its words", () => {
    const actions = playerKeys.map((k) => k.action);
    expect(new Set(actions).size).toBe(actions.length);
    for (const k of playerKeys) expect(k.does.length).toBeGreaterThan(5);
  });
});
