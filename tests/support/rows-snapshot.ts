import type { TestApp } from "./test-app";

/**
 * Each table's row count and a digest of its rows, but the session store's (sessions roll on each
 * request) and the rate limits' counters (they count tries, refused ones too).
 */
export async function tableFingerprints(app: TestApp): Promise<Map<string, string>> {
  const tables = await app.database.pool.query<{ table_name: string }>(
    "select table_name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' and table_name not in ('session', 'rate_limit_counters') order by 1",
  );
  const fingerprints = new Map<string, string>();
  for (const { table_name } of tables.rows) {
    const result = await app.database.pool.query<{ n: number; sum: string }>(
      `select count(*)::int as n, coalesce(md5(string_agg(md5(t::text), '' order by md5(t::text))), '') as sum from "${table_name}" t`,
    );
    fingerprints.set(table_name, `${result.rows[0]!.n}:${result.rows[0]!.sum}`);
  }
  return fingerprints;
}

/** The tables whose rows differ between two fingerprints. */
export function changedTables(before: Map<string, string>, after: Map<string, string>): string[] {
  return [...after.keys()].filter((table) => before.get(table) !== after.get(table));
}

/**
 * Makes every write to a table fail, as a disk or a constraint might at the worst moment: a statement
 * trigger that raises. `restore` takes it away again.
 */
export async function refuseWritesTo(app: TestApp, table: string): Promise<{ restore: () => Promise<void> }> {
  const pool = app.database.pool;
  await pool.query(`create or replace function kerf_test_refuse_write() returns trigger language plpgsql as $$
    begin raise exception 'test fault: writes to % refused', tg_table_name; end $$`);
  await pool.query(`create trigger kerf_test_refuse_write before insert or update or delete on "${table}" for each statement execute function kerf_test_refuse_write()`);
  return { restore: async () => void (await pool.query(`drop trigger if exists kerf_test_refuse_write on "${table}"`)) };
}

/** A fingerprint of every table's rows but the session store's and the counters': equal before and after means nothing changed. */
export async function rowsSnapshot(app: TestApp): Promise<string> {
  return [...(await tableFingerprints(app))].map(([table, fingerprint]) => `${table}:${fingerprint}`).join("\n");
}
