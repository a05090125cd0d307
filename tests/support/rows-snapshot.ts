import type { TestApp } from "./test-app";

/** A fingerprint of every table's rows but the session store's: equal before and after means nothing changed. */
export async function rowsSnapshot(app: TestApp): Promise<string> {
  const tables = await app.database.pool.query<{ table_name: string }>(
    "select table_name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' and table_name <> 'session' order by 1",
  );
  const parts: string[] = [];
  for (const { table_name } of tables.rows) {
    const result = await app.database.pool.query<{ n: number; sum: string }>(
      `select count(*)::int as n, coalesce(md5(string_agg(md5(t::text), '' order by md5(t::text))), '') as sum from "${table_name}" t`,
    );
    parts.push(`${table_name}:${result.rows[0]!.n}:${result.rows[0]!.sum}`);
  }
  return parts.join("\n");
}
