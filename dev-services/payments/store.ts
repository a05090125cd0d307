import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from "node:fs";
import path from "node:path";
import { randomToken, unixNow } from "./ids";
import type { AccountState, InvoiceRecord } from "./records";

/**
 * Everything the stand-in knows, in memory and, when it has a file, written to it shortly after
 * every change (to a temporary file, then renamed), so `npm start` finds its customers, invoices,
 * events and unfinished webhook deliveries again after a restart.
 */
interface StandInState {
  version: 1;
  seq: number;
  defaultAccountId: string | null;
  accounts: Record<string, AccountState>;
}

export interface AccountKeys {
  name: string;
  secretKey?: string;
  webhookSecret?: string;
}

// The provider keeps idempotency keys for at least 24 hours; older ones may be pruned.
const IDEMPOTENCY_SECONDS = 24 * 60 * 60;
const WRITE_DELAY_MS = 50;

export const newSecretKey = () => `sk_test_${randomToken(32)}`;
export const newWebhookSecret = () => `whsec_${randomToken(32)}`;

export class Store {
  private pendingWrite: NodeJS.Timeout | undefined;

  private constructor(
    private readonly state: StandInState,
    private readonly file: string | null,
  ) {}

  static open(file: string | null): Store {
    const state: StandInState =
      file && existsSync(file) ? (JSON.parse(readFileSync(file, "utf8")) as StandInState) : { version: 1, seq: 0, defaultAccountId: null, accounts: {} };
    const store = new Store(state, file);
    store.pruneIdempotency();
    return store;
  }

  get accounts(): AccountState[] {
    return Object.values(this.state.accounts);
  }

  nextSeq(): number {
    this.state.seq += 1;
    return this.state.seq;
  }

  accountForKey(secretKey: string): AccountState | undefined {
    return this.accounts.find((account) => account.secretKey === secretKey);
  }

  createAccount(keys: AccountKeys): AccountState {
    const account: AccountState = {
      id: `acct_${randomToken(16)}`,
      name: keys.name,
      secretKey: keys.secretKey ?? newSecretKey(),
      webhookSecret: keys.webhookSecret ?? newWebhookSecret(),
      holdDeliveries: false,
      customers: {},
      invoices: {},
      invoiceItems: {},
      events: {},
      webhookEndpoints: {},
      deliveries: {},
      idempotency: {},
    };
    this.state.accounts[account.id] = account;
    this.save();
    return account;
  }

  /** The account `npm start` and `npm test` hand to the app; its keys follow the configuration. */
  ensureDefaultAccount(keys: Required<AccountKeys>): AccountState {
    const existing = this.state.defaultAccountId ? this.state.accounts[this.state.defaultAccountId] : undefined;
    if (existing) {
      Object.assign(existing, keys);
      this.save();
      return existing;
    }
    const account = this.createAccount(keys);
    this.state.defaultAccountId = account.id;
    this.save();
    return account;
  }

  invoiceByHostedToken(token: string): { account: AccountState; invoice: InvoiceRecord } | undefined {
    for (const account of this.accounts) {
      const invoice = Object.values(account.invoices).find((candidate) => candidate.hostedToken === token);
      if (invoice) return { account, invoice };
    }
    return undefined;
  }

  /**
   * Asks for the state to be written. Writes are gathered (at most one every WRITE_DELAY_MS), since
   * each rewrites the whole file; flush() writes at once, and stopping the stand-in flushes.
   */
  save(): void {
    if (!this.file || this.pendingWrite) return;
    this.pendingWrite = setTimeout(() => this.flush(), WRITE_DELAY_MS);
  }

  flush(): void {
    clearTimeout(this.pendingWrite);
    this.pendingWrite = undefined;
    if (!this.file) return;
    mkdirSync(path.dirname(this.file), { recursive: true });
    const temporary = `${this.file}.${process.pid}.tmp`;
    writeFileSync(temporary, JSON.stringify(this.state));
    renameSync(temporary, this.file);
  }

  pruneIdempotency(): void {
    const oldest = unixNow() - IDEMPOTENCY_SECONDS;
    for (const account of this.accounts) {
      for (const [key, record] of Object.entries(account.idempotency)) {
        if (record.created < oldest) delete account.idempotency[key];
      }
    }
  }
}
