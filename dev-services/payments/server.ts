import http from "node:http";
import type { AddressInfo } from "node:net";
import { createStandInApp } from "./app";
import { Store } from "./store";
import { addWebhookEndpoint } from "./webhook-endpoints";
import { DEMO_RETRY, WebhookSender, type RetryPolicy } from "./webhooks";

/**
 * Kerf's local stand-in for its payments provider: a small HTTP server that speaks the part of the
 * provider's REST API that invoicing needs, as the provider's own SDK sends it, keeps its state in a
 * JSON file, posts signed webhook events and serves the invoice pages a sponsor pays on.
 * `npm start` and `npm test` start it (dev-services/start.ts, dev-services/test-run.ts).
 */
export interface PaymentsStandInOptions {
  port: number;
  host?: string;
  /** Where it keeps its state; without a file it forgets everything when stopped. */
  dataFile?: string;
  secretKey: string;
  webhookSecret: string;
  /** Shown as the biller on the invoice pages. */
  accountName?: string;
  /** Endpoints that receive every event of the default account (e.g. the app's webhook route). */
  webhookUrls?: string[];
  retry?: Partial<RetryPolicy>;
}

export interface PaymentsStandIn {
  url: string;
  secretKey: string;
  webhookSecret: string;
  /** The settings the app will read (PAYMENTS_API_URL, PAYMENTS_SECRET_KEY, PAYMENTS_WEBHOOK_SECRET). */
  env: Record<string, string>;
  stop(): Promise<void>;
}

const HOUR = 60 * 60 * 1000;
/** Where `npm start` and the browser tests send the events: the app's webhook route (to come with invoicing). */
export const APP_WEBHOOK_PATH = "/api/payments/webhook";

export async function startPaymentsStandIn(options: PaymentsStandInOptions): Promise<PaymentsStandIn> {
  const host = options.host ?? "127.0.0.1";
  const store = Store.open(options.dataFile ?? null);
  const account = store.ensureDefaultAccount({ name: options.accountName ?? "Kerf demo channel", secretKey: options.secretKey, webhookSecret: options.webhookSecret });
  for (const url of options.webhookUrls ?? []) {
    if (!Object.values(account.webhookEndpoints).some((endpoint) => endpoint.url === url)) {
      addWebhookEndpoint(account, store.nextSeq(), url, ["*"], "Kerf, configured when the stand-in started");
    }
  }
  store.flush();
  const sender = new WebhookSender(store, { ...DEMO_RETRY, ...options.retry });
  let url = "";
  const server = http.createServer(createStandInApp(store, sender, () => url));
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port, host, () => resolve());
  });
  url = `http://${host}:${(server.address() as AddressInfo).port}`;
  sender.resume();
  const pruning = setInterval(() => store.pruneIdempotency(), HOUR);
  pruning.unref();
  return {
    url,
    secretKey: options.secretKey,
    webhookSecret: options.webhookSecret,
    env: { PAYMENTS_API_URL: url, PAYMENTS_SECRET_KEY: options.secretKey, PAYMENTS_WEBHOOK_SECRET: options.webhookSecret },
    async stop() {
      clearInterval(pruning);
      await sender.stop();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      store.flush();
    },
  };
}
