import type pg from "pg";

/**
 * What PostgreSQL did for a run, from its pg_stat_statements extension (Debian's postgresql ships it;
 * the cluster must load it: STATEMENT_STATS_SETTINGS).
 */
export const STATEMENT_STATS_SETTINGS = ["shared_preload_libraries=pg_stat_statements", "pg_stat_statements.track_planning=on"];

export async function startCountingStatements(pool: pg.Pool): Promise<void> {
  await pool.query("create extension if not exists pg_stat_statements");
  await pool.query("select pg_stat_statements_reset()");
}

export interface StatementFigures {
  perRequest: number;
  planMsPerRequest: number;
  execMsPerRequest: number;
  top: { calls: number; ms: number; text: string }[];
}

/** Statements, planning and running time per request since the last reset, and the costliest statements. */
export async function statementFigures(pool: pg.Pool, requests: number): Promise<StatementFigures> {
  const mine = "query not like '%pg_stat_statements%'";
  const total = await pool.query<{ calls: string; plan: number; exec: number }>(
    `select coalesce(sum(calls), 0) as calls, coalesce(sum(total_plan_time), 0) as plan, coalesce(sum(total_exec_time), 0) as exec from pg_stat_statements where ${mine}`,
  );
  const top = await pool.query<{ calls: string; ms: number; text: string }>(
    `select calls, total_plan_time + total_exec_time as ms, left(regexp_replace(query, '\\s+', ' ', 'g'), 90) as text from pg_stat_statements where ${mine} order by ms desc limit 5`,
  );
  const per = (value: number) => Math.round((value / Math.max(1, requests)) * 1000) / 1000;
  const row = total.rows[0]!;
  return {
    perRequest: Math.round((Number(row.calls) / Math.max(1, requests)) * 100) / 100,
    planMsPerRequest: per(row.plan),
    execMsPerRequest: per(row.exec),
    top: top.rows.map((r) => ({ calls: Number(r.calls), ms: Math.round(r.ms), text: r.text })),
  };
}
