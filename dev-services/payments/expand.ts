import { invalidParam } from "./api-error";
import type { AccountState } from "./records";
import { customerView, invoiceView } from "./views";

/**
 * `expand[]`: replaces an id in the answer with the object it names: `customer` and `invoice`, or
 * in a list `data.customer` and `data.invoice`. Other paths are refused before the request does
 * anything, as the provider refuses them.
 */
const EXPANDABLE = /^(data\.)?(customer|invoice)$/;

export function checkExpandable(paths: string[]): void {
  const wrong = paths.find((path) => !EXPANDABLE.test(path));
  if (wrong !== undefined) throw invalidParam("expand", `This property cannot be expanded (${wrong}).`);
}

export function applyExpand(body: unknown, paths: string[], account: AccountState, baseUrl: string): unknown {
  for (const path of paths) {
    const [first, second] = path.split(".");
    const holders = second === undefined ? [body] : listData(body);
    const field = second ?? first!;
    for (const holder of holders) expandField(holder, field, account, baseUrl);
  }
  return body;
}

function listData(body: unknown): unknown[] {
  const data = (body as { data?: unknown } | null)?.data;
  return Array.isArray(data) ? data : [];
}

function expandField(holder: unknown, field: string, account: AccountState, baseUrl: string): void {
  if (!holder || typeof holder !== "object") return;
  const record = holder as Record<string, unknown>;
  const id = record[field];
  if (typeof id !== "string") return;
  const customer = account.customers[id];
  const invoice = account.invoices[id];
  if (customer) record[field] = customerView(customer);
  else if (invoice) record[field] = invoiceView(account, invoice, baseUrl);
}
