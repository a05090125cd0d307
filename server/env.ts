import { availableParallelism } from "node:os";
import { z } from "zod";

/** Every setting the server reads, checked once at start. Nothing else reads process.env. */
const envSchema = z.object({
  NODE_ENV: z.enum(["development", "test", "production"]).default("development"),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  /** Server processes `npm run serve` and `npm start` run, sharing only PostgreSQL and storage: one per core unless set. */
  KERF_WORKERS: z.coerce.number().int().min(1).max(64).default(availableParallelism()),
  HOST: z.string().default("127.0.0.1"),
  DATABASE_URL: z.string().url(),
  SESSION_SECRET: z.string().min(32, "SESSION_SECRET must be at least 32 characters"),
  APP_URL: z.string().url().default("http://127.0.0.1:3000"),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(1025),
  SMTP_SECURE: z.enum(["true", "false"]).default("false").transform((v) => v === "true"),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default("Kerf <kerf@example.com>"),
  /** Set when the app sits behind a TLS-terminating proxy: cookies become Secure. */
  TRUST_PROXY: z.enum(["true", "false"]).default("false").transform((v) => v === "true"),
  CLIENT_DIST: z.string().default("dist/client"),
  /** The Chromium that draws pictures in jobs (the results card): Debian's, unless set. */
  CHROMIUM_PATH: z.string().min(1).default("/usr/bin/chromium"),
  /** Sign-ups allowed from one address in 15 minutes: raise it where many people share one address. */
  SIGN_UPS_PER_ADDRESS: z.coerce.number().int().min(1).default(10),
  // Object storage for footage: any S3-compatible store. The defaults point at the local stand-in of
  // dev-services/s3.ts; its key pair is made per data folder, so `npm start` passes it in.
  S3_ENDPOINT: z
    .string()
    .default("http://127.0.0.1:4568")
    .refine((v) => v === "" || URL.canParse(v), "S3_ENDPOINT must be a URL (or empty for AWS's own endpoints)"),
  S3_REGION: z.string().min(1).default("us-east-1"),
  S3_BUCKET: z.string().min(3, "S3_BUCKET must name a bucket").default("kerf-rushes"),
  S3_ACCESS_KEY_ID: z.string({ message: "S3_ACCESS_KEY_ID must be set (the storage key pair)" }).min(1),
  S3_SECRET_ACCESS_KEY: z.string({ message: "S3_SECRET_ACCESS_KEY must be set (the storage key pair)" }).min(1),
  /** true for the stand-in and most S3-compatible stores; AWS itself takes either. */
  S3_FORCE_PATH_STYLE: z.enum(["true", "false"]).default("true").transform((v) => v === "true"),
  // The payments provider for sponsor invoices, reached only through its SDK. Empty API URL: the
  // provider's own; `npm start` points it at the stand-in. Without a key, invoicing answers 503.
  PAYMENTS_API_URL: z
    .string()
    .default("")
    .refine((v) => v === "" || URL.canParse(v), "PAYMENTS_API_URL must be a URL (or empty for the provider's own API)"),
  PAYMENTS_SECRET_KEY: z.string().default(""),
  /**
   * How often every job worker asks for work, in seconds (pg-boss takes 0.5 at least). Unset, each
   * keeps its own pace (mail, clip media, cards, reports 2 s; the reminder scan 5 s): a quicker pace
   * only adds queries. The browser tests' server sets it low, so a journey waits on a job, not on a poll.
   */
  JOB_POLL_SECONDS: z.coerce.number().min(0.5).max(60).optional(),
  PAYMENTS_WEBHOOK_SECRET: z.string().default(""),
});

export type Env = z.infer<typeof envSchema>;

export function readEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join(".")}: ${issue.message}`);
    throw new Error(`Kerf cannot start; fix these settings:\n${lines.join("\n")}`);
  }
  return parsed.data;
}
