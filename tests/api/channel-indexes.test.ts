import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { allRecipes, featureAccess, fillPath, makeAccessWorld } from "../support/access-world";
import { createTestDatabase, type TestDatabase } from "../support/database";
import { startTestApp, type TestApp } from "../support/test-app";
import type { AccessWorld, Recipe } from "./access/matrix";

/*
 * Many channels share one database, so a query about one channel must find that channel's rows through
 * an index that leads with the channel, never by reading past everyone else's. This file runs every
 * route of the access matrix as the channel's owner with PostgreSQL's auto_explain writing each
 * statement's plan back to the connection (F.4 "auto_explain", PostgreSQL 15 documentation), and
 * sequential scans priced out (enable_seqscan = off, "Planner Method Configuration"), so a scan that is
 * still sequential had no index it could use. Every read of a table that has a channel_id must then be
 * an index scan searched by the index's leading column, where that column is
 * - channel_id: the channel's rows, or
 * - a foreign key: the rows of one parent row (a deal's items, an episode's moves), and a parent row
 *   belongs to one channel, so the read never passes another channel's rows; or
 * - a unique key: one row fetched by its id (from a path, or the inner side of a join).
 */

interface PlanNode {
  "Node Type": string;
  "Relation Name"?: string;
  "Index Name"?: string;
  "Index Cond"?: string;
  Plans?: PlanNode[];
}
interface IndexInfo {
  table: string;
  firstColumn: string;
  unique: boolean;
  /** The leading column is a foreign key of its own: the index finds one parent row's rows. */
  byParent: boolean;
}

let database: TestDatabase;
let app: TestApp;
let world: AccessWorld;
let recipes: Record<string, Recipe>;
let recording = false;
const plans: { statement: string; plan: PlanNode }[] = [];
let channelTables = new Set<string>();
const indexes = new Map<string, IndexInfo>();

async function explainEveryStatement(url: string, name: string) {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    for (const setting of [
      "session_preload_libraries = 'auto_explain'",
      "auto_explain.log_min_duration = 0",
      "auto_explain.log_format = 'json'",
      "client_min_messages = 'log'",
      "enable_seqscan = off",
    ])
      await client.query(`alter database "${name}" set ${setting}`);
  } finally {
    await client.end();
  }
}

function keepPlan(message: string) {
  if (!recording) return;
  const at = message.indexOf("{");
  if (!message.includes("plan:") || at < 0) return;
  const explained = JSON.parse(message.slice(at)) as { "Query Text": string; Plan: PlanNode };
  plans.push({ statement: explained["Query Text"], plan: explained.Plan });
}

async function readCatalog() {
  const tables = await database.pool.query<{ table_name: string }>(
    "select table_name from information_schema.columns where table_schema = 'public' and column_name = 'channel_id'",
  );
  channelTables = new Set(tables.rows.map((row) => row.table_name));
  const found = await database.pool.query<{ index: string; table: string; first_column: string; unique: boolean; by_parent: boolean }>(
    `select ic.relname as index, t.relname as table, a.attname as first_column, i.indisunique as unique,
       exists (select 1 from pg_constraint f where f.conrelid = t.oid and f.contype = 'f' and f.conkey = array[i.indkey[0]]) as by_parent
     from pg_index i join pg_class ic on ic.oid = i.indexrelid join pg_class t on t.oid = i.indrelid
     join pg_namespace n on n.oid = t.relnamespace and n.nspname = 'public'
     join pg_attribute a on a.attrelid = t.oid and a.attnum = i.indkey[0]`,
  );
  for (const row of found.rows) indexes.set(row.index, { table: row.table, firstColumn: row.first_column, unique: row.unique, byParent: row.by_parent });
}

function searchedByLeadingColumn(index: IndexInfo, condition: string): boolean {
  const leading = condition.includes(`${index.firstColumn} =`) || condition.includes(`"${index.firstColumn}" =`);
  return leading && (index.firstColumn === "channel_id" || index.byParent || index.unique);
}

/** The scans of channel tables that read more than one channel's rows, as "table via how". */
function wideScans(node: PlanNode, found: string[] = []): string[] {
  const index = node["Index Name"] ? indexes.get(node["Index Name"]) : undefined;
  const table = node["Relation Name"] ?? index?.table;
  if (table && channelTables.has(table)) {
    const condition = node["Index Cond"] ?? "";
    if (!node["Index Name"]) {
      // A write's own node, and the heap side of a bitmap scan whose index side is checked on its own.
      if (!["ModifyTable", "Bitmap Heap Scan"].includes(node["Node Type"])) found.push(`${table} via ${node["Node Type"]}`);
    } else if (!index || !condition) {
      found.push(`${table} via ${node["Index Name"]} read whole`);
    } else if (!searchedByLeadingColumn(index, condition)) {
      found.push(`${table} via ${node["Index Name"]} (${condition})`);
    }
  }
  for (const child of node.Plans ?? []) wideScans(child, found);
  return found;
}

beforeAll(async () => {
  database = await createTestDatabase();
  await explainEveryStatement(database.url, database.name);
  database.pool.on("connect", (client) => client.on("notice", (notice) => keepPlan(notice.message ?? "")));
  app = await startTestApp({ database });
  world = await makeAccessWorld(app);
  recipes = allRecipes(app, world);
  await readCatalog();
});
afterAll(() => app.close());

describe("channel-scoped queries", () => {
  it("when every route runs as the owner, then every read of a channel's table goes through an index that leads with the channel", async () => {
    const routes = featureAccess.flatMap((access) => access.rows).map(([route]) => route);
    const owner = await app.signedIn(world.owner);
    recording = true;
    for (const route of routes) {
      const recipe = recipes[route]!;
      const [method, template] = route.split(" ") as [string, string];
      const prepared = (await recipe.prepare?.({ caller: "owner", person: world.owner })) ?? {};
      const path = fillPath(template, { channelId: world.channel.id, ...prepared.params });
      if (method === "GET") await owner.get(path);
      else await owner.send(method.toLowerCase() as "post" | "put" | "patch" | "delete", path, prepared.body);
    }
    recording = false;
    const wide = new Map<string, string>();
    for (const { statement, plan } of plans) for (const scan of wideScans(plan)) wide.set(scan, statement.slice(0, 300));
    console.log(`channel indexes: ${plans.length} statements' plans read over ${routes.length} routes`);
    expect(plans.length).toBeGreaterThan(routes.length);
    expect([...wide].map(([scan, statement]) => `${scan}\n    in: ${statement}`)).toEqual([]);
  }, 300_000);
});
