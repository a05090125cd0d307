import { randomBytes } from "node:crypto";

const ALPHANUMERIC = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";

export function randomToken(length: number, alphabet = ALPHANUMERIC): string {
  let token = "";
  for (const byte of randomBytes(length)) token += alphabet[byte % alphabet.length];
  return token;
}

/** Ids shaped like the provider's: a type prefix and random characters (cus_…, in_…, ii_…, il_…, evt_…, we_…, req_…). */
export const newId = (prefix: string) => `${prefix}_${randomToken(24)}`;

/** The provider's timestamps are whole unix seconds. */
export const unixNow = () => Math.floor(Date.now() / 1000);
