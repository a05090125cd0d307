import { spawn, type ChildProcess } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { stopChild, waitForHttp } from "./processes";

/**
 * The local S3-compatible stand-in: s3rver, run as its own process on 127.0.0.1 with a data folder
 * and one bucket whose CORS rule lets the app's pages PUT parts and read the ETag header.
 * Node's --openssl-legacy-provider is needed: its paged listings use a cipher OpenSSL 3 refuses.
 * Its fixed development key pair (S3RVER / S3RVER) is the only one it knows.
 */
export interface S3StandIn {
  endpoint: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  /** The settings the app reads (server/env.ts), ready to spread into an env. */
  env: Record<string, string>;
  stop(): Promise<void>;
}

const s3rverBin = path.resolve(import.meta.dirname, "../node_modules/s3rver/bin/s3rver.js");

const escapeXml = (text: string) => text.replace(/[<>&"']/g, (c) => `&#${c.charCodeAt(0)};`);

export function corsXml(origins: string[]): string {
  const allowed = origins.map((o) => `    <AllowedOrigin>${escapeXml(o)}</AllowedOrigin>`).join("\n");
  return `<CORSConfiguration>
  <CORSRule>
${allowed}
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>
`;
}

export async function startS3StandIn(options: { port: number; dataDir: string; bucket?: string; origins: string[] }): Promise<S3StandIn> {
  const bucket = options.bucket ?? "kerf-rushes";
  mkdirSync(options.dataDir, { recursive: true });
  const corsFile = path.join(options.dataDir, `cors-${bucket}.xml`);
  writeFileSync(corsFile, corsXml(options.origins));
  const child: ChildProcess = spawn(
    process.execPath,
    ["--openssl-legacy-provider", s3rverBin, "-d", options.dataDir, "-a", "127.0.0.1", "-p", String(options.port), "--silent", "--no-vhost-buckets", "--configure-bucket", bucket, corsFile],
    { stdio: ["ignore", "ignore", "inherit"] },
  );
  const endpoint = `http://127.0.0.1:${options.port}`;
  await waitForHttp(`${endpoint}/`, 20_000);
  const accessKeyId = "S3RVER";
  const secretAccessKey = "S3RVER";
  return {
    endpoint,
    bucket,
    accessKeyId,
    secretAccessKey,
    env: {
      S3_ENDPOINT: endpoint,
      S3_REGION: "us-east-1",
      S3_BUCKET: bucket,
      S3_ACCESS_KEY_ID: accessKeyId,
      S3_SECRET_ACCESS_KEY: secretAccessKey,
      S3_FORCE_PATH_STYLE: "true",
    },
    stop: () => stopChild(child),
  };
}
