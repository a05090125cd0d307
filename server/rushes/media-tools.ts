import { spawn } from "node:child_process";

/**
 * Debian's ffmpeg and ffprobe, run without a shell (arguments are a list, never a command line),
 * each with a time limit and bounded output. Inputs are presigned storage URLs, so the tools may
 * speak HTTP(S) and nothing else (no file:, no pipes), and read only camera containers: a playlist
 * or concat list uploaded as footage can't make them open anything else.
 */
export const INPUT_GUARDS = [
  "-protocol_whitelist",
  "http,https,tcp,tls",
  "-format_whitelist",
  "mov,mp4,m4a,3gp,3g2,mj2,matroska,webm,mxf,avi,mpegts,wav,mpeg",
];

/** What went wrong with a tool, with words a person can read on the clip. */
export class MediaToolError extends Error {
  constructor(
    readonly reason: string,
    readonly detail: string,
  ) {
    super(`${reason} (${detail})`);
  }
}

export interface ToolLimits {
  timeoutMs: number;
  /** Standard output kept at most (ffprobe's JSON); more stops the tool. */
  maxStdoutBytes?: number;
}

const STDERR_KEPT = 4_000;

/** Runs one tool to its end; answers its standard output, or throws MediaToolError. */
export function runTool(tool: "ffmpeg" | "ffprobe", args: string[], limits: ToolLimits, what: string): Promise<string> {
  return new Promise((resolve, reject) => {
    const child = spawn(tool, ["-hide_banner", ...(tool === "ffmpeg" ? ["-nostdin"] : []), "-loglevel", "error", ...args], { stdio: ["ignore", "pipe", "pipe"], shell: false });
    const out: Buffer[] = [];
    let outBytes = 0;
    let errTail = "";
    let stopped: MediaToolError | null = null;
    const stop = (error: MediaToolError) => {
      stopped ??= error;
      child.kill("SIGKILL");
    };
    const timer = setTimeout(() => stop(new MediaToolError(`${what} took longer than ${spell(limits.timeoutMs)}, so the server stopped it.`, "time limit")), limits.timeoutMs);
    child.stdout.on("data", (chunk: Buffer) => {
      outBytes += chunk.length;
      if (limits.maxStdoutBytes !== undefined && outBytes > limits.maxStdoutBytes) stop(new MediaToolError(`${what} gave more output than the server reads.`, "output limit"));
      else out.push(chunk);
    });
    child.stderr.on("data", (chunk: Buffer) => {
      errTail = (errTail + chunk.toString("utf8")).slice(-STDERR_KEPT);
    });
    child.on("error", (error: NodeJS.ErrnoException) => {
      clearTimeout(timer);
      if (error.code === "ENOENT") reject(new MediaToolError(`The server has no ${tool} installed, so it can't make a poster or proxy; tell whoever runs Kerf.`, `${tool} missing`));
      else reject(new MediaToolError(`The server couldn't start ${tool}.`, error.message));
    });
    child.on("close", (code) => {
      clearTimeout(timer);
      if (stopped) reject(stopped);
      else if (code !== 0) reject(new MediaToolError(`${what} failed: the file may be damaged, unfinished or not a video the server can read.`, lastLine(errTail) || `exit ${code}`));
      else resolve(Buffer.concat(out).toString("utf8"));
    });
  });
}

function spell(ms: number): string {
  if (ms >= 120_000) return `${Math.round(ms / 60_000)} minutes`;
  const seconds = Math.max(1, Math.ceil(ms / 1000));
  return seconds === 1 ? "1 second" : `${seconds} seconds`;
}

/** The tool's last word, with any URL (a presigned link is a key to the file) left out. */
function lastLine(text: string): string {
  return text.trim().split("\n").at(-1)?.replace(/https?:\/\/\S+/g, (url) => (url.endsWith(":") ? "the file:" : "the file")).slice(0, 300) ?? "";
}
