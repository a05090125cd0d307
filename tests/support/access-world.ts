import { createChannel, createCrewedChannel, createUser } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import type { AccessWorld, FeatureAccess, Recipe } from "../api/access/matrix";
import type { TestApp } from "./test-app";

// Every feature's part of the route table: a new file in tests/api/access/ joins by itself.
const modules = import.meta.glob<{ access: FeatureAccess }>("../api/access/*.ts", { eager: true });

export const featureAccess: FeatureAccess[] = Object.entries(modules)
  .filter(([file]) => !file.endsWith("/matrix.ts"))
  .map(([, module]) => module.access);

/** The channel every call aims at, one account per role, and the owner of another channel. */
export async function makeAccessWorld(app: TestApp): Promise<AccessWorld> {
  const crewed = await createCrewedChannel(app.db, "Matrix Channel");
  const outsider = await createUser(app.db, { name: "Ozzy Outsider" });
  await createChannel(app.db, outsider, "Elsewhere");
  const episode = await createEpisode(app.db, crewed.channel.id, { title: "Matrix episode" });
  const { owner, producer, editor, crew } = crewed;
  return { channel: crewed.channel, owner, people: { owner, producer, editor, crew, outsider }, episode };
}

export function allRecipes(app: TestApp, world: AccessWorld): Record<string, Recipe> {
  return Object.assign({}, ...featureAccess.map((access) => access.recipes({ app, world })));
}

export function fillPath(template: string, params: Record<string, string>): string {
  return template.replace(/:(\w+)/g, (_match, name: string) => {
    const value = params[name];
    if (value === undefined) throw new Error(`no value for :${name} in ${template}`);
    return encodeURIComponent(value);
  });
}
