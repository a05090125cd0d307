import { readFileSync } from "node:fs";
import { loadavg } from "node:os";
import type pg from "pg";
import { percentile } from "./measure";

/**
 * The export part of `npm run bench:rushes`: a channel of 5,000 clips × 10 marks exported as CSV (50,000
 * records), timed to the last byte, while a member of another channel keeps asking for one clip: the
 * longest of those one-row answers is the export's stall. Half the channel is exported too, in the same
 * run, so the ratio of the two times shows whether the cost grows in step with the size.
 */
export const EXPORT_CLIPS = 5_000;
const MARKS_PER_CLIP = 10;
const RUNS = 3;

type Get = (url: string) => Promise<Response>;

export interface ExportFigures {
  export_5k_ms: number;
  export_max_stall_ms: number;
  export_half_ms: number;
  export_size_ratio: number;
  export_rows: number;
  one_row_idle_p50_ms: number;
  one_row_idle_max_ms: number;
  export_5k_server_cpu_ms: number;
}

/** 5,000 clips over two episodes, each with 10 marks of one second, in two statements. */
export async function seedExportChannel(pool: pg.Pool, channelId: string, episodeIds: [string, string]) {
  await pool.query(
    `insert into clips (channel_id, episode_id, object_key, file_name, content_type, size_bytes, duration_ms,
       frame_rate_numerator, frame_rate_denominator, drop_frame, start_timecode, camera, recorded_at, tags, notes, mark_count)
     select $1::uuid, ($2::uuid[])[1 + i % 2], $1::text || '/export/' || i, 'E' || lpad(i::text, 6, '0') || '.mov', 'video/quicktime',
       100000000 + i, 60060, 30000, 1001, true, '01:00:00;00', 'A cam', timestamptz '2026-03-01' + (i || ' minutes')::interval,
       array['bench'], 'logged on the bench, take ' || i, ${MARKS_PER_CLIP}
     from generate_series(1, $3) as i`,
    [channelId, `{${episodeIds.join(",")}}`, EXPORT_CLIPS],
  );
  // Frame 107,892 is 01:00:00;00 at 29.97 drop-frame; each mark is one second (30 frames) of the clip's minute.
  await pool.query(
    `insert into clip_marks (channel_id, clip_id, in_frame, out_frame, in_label, out_label, note)
     select c.channel_id, c.id, 107892 + m * 60, 107922 + m * 60,
       '01:00:' || lpad((m * 2)::text, 2, '0') || ';00', '01:00:' || lpad((m * 2 + 1)::text, 2, '0') || ';00', 'mark ' || m
     from clips c cross join generate_series(0, ${MARKS_PER_CLIP - 1}) as m where c.channel_id = $1`,
    [channelId],
  );
  await pool.query("analyze clips; analyze clip_marks");
}

async function timedBody(get: Get, url: string): Promise<{ ms: number; text: string }> {
  const started = performance.now();
  const response = await get(url);
  const text = await response.text();
  if (!response.ok) throw new Error(`${url}: ${response.status} ${text.slice(0, 300)}`);
  return { ms: performance.now() - started, text };
}

/** One-row requests, one after another, until `done` settles: each answer's time. */
async function pollWhile(done: Promise<unknown>, get: Get, url: string): Promise<number[]> {
  let finished = false;
  void done.finally(() => (finished = true));
  const times: number[] = [];
  while (!finished) times.push((await timedBody(get, url)).ms);
  return times;
}

/** The CPU time a process has used so far (Linux /proc/PID/stat: utime and stime, in clock ticks of 10 ms). */
export function cpuMsOf(pid: number): number {
  const fields = readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1]!.split(" ");
  return (Number(fields[11]) + Number(fields[12])) * 10;
}

export async function benchExport(opts: { exporter: Get; other: Get; exportBase: string; episodeId: string; oneRowUrl: string; serverPid: number }): Promise<ExportFigures> {
  const { exporter, other, exportBase, episodeId, oneRowUrl, serverPid } = opts;
  const csv = `${exportBase}/exports/footage.csv`;
  // One untimed export first, so the timed ones meet a warmed-up server (common practice for a benchmark).
  await timedBody(exporter, `${csv}?episodeId=${episodeId}`);
  const idle: number[] = [];
  for (let i = 0; i < 50; i++) idle.push((await timedBody(other, oneRowUrl)).ms);
  idle.sort((a, b) => a - b);

  const half: number[] = [];
  const whole: number[] = [];
  const stalls: number[] = [];
  const cpu: number[] = [];
  let rows = 0;
  for (let run = 0; run < RUNS; run++) {
    half.push((await timedBody(exporter, `${csv}?episodeId=${episodeId}`)).ms);
    const cpuBefore = cpuMsOf(serverPid);
    const exported = timedBody(exporter, csv);
    const during = await pollWhile(exported, other, oneRowUrl);
    const { ms, text } = await exported;
    // The server's CPU time over the export, its one-row answers included: what a busy machine can't inflate much.
    cpu.push(cpuMsOf(serverPid) - cpuBefore);
    whole.push(ms);
    stalls.push(...during);
    rows = text.split("\r\n").length - 2; // the header, and the empty string after the last CRLF
  }
  half.sort((a, b) => a - b);
  whole.sort((a, b) => a - b);
  cpu.sort((a, b) => a - b);
  const median = (sorted: number[]) => sorted[Math.floor(sorted.length / 2)]!;
  console.log(`\n── export of ${EXPORT_CLIPS.toLocaleString("en")} clips × ${MARKS_PER_CLIP} marks (CSV), ${RUNS} runs ──`);
  console.log(`whole channel: ${whole.map((t) => t.toFixed(0)).join(", ")} ms → median ${median(whole).toFixed(0)} ms, ${rows.toLocaleString("en")} records`);
  console.log(`server CPU time during it: median ${median(cpu)} ms (the machine's load average: ${loadavg().map((l) => l.toFixed(1)).join(", ")})`);
  console.log(`half (one episode): median ${median(half).toFixed(0)} ms; whole ÷ half = ${(median(whole) / median(half)).toFixed(2)} (2.00 is linear)`);
  console.log(`one clip from another channel: idle p50 ${percentile(idle, 50).toFixed(1)} ms, longest ${idle.at(-1)!.toFixed(1)} ms; during the exports ${stalls.length} answers, longest ${Math.max(...stalls).toFixed(1)} ms`);
  return {
    export_5k_ms: Number(median(whole).toFixed(0)),
    export_max_stall_ms: Number(Math.max(...stalls).toFixed(1)),
    export_half_ms: Number(median(half).toFixed(0)),
    export_size_ratio: Number((median(whole) / median(half)).toFixed(2)),
    export_rows: rows,
    one_row_idle_p50_ms: Number(percentile(idle, 50).toFixed(1)),
    one_row_idle_max_ms: Number(idle.at(-1)!.toFixed(1)),
    export_5k_server_cpu_ms: median(cpu),
  };
}
