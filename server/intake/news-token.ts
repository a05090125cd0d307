import { createHmac, timingSafeEqual } from "node:crypto";

/**
 * The "stop writing to me" link of a viewer's mail: the contact's id and an HMAC-SHA-256 of it under
 * the server's secret (RFC 2104), so the link keeps working for every mail and cannot be made for another address.
 */
export function newsTokens(secret: string) {
  const mac = (contactId: string) => createHmac("sha256", secret).update(`intake-unsubscribe:${contactId}`).digest("base64url");
  return {
    make: (contactId: string) => `${contactId}.${mac(contactId)}`,
    /** The contact id the token names, or null when it was not made here. */
    read(token: string): string | null {
      const [contactId, given] = token.split(".");
      if (!contactId || !given || !/^[0-9a-f-]{36}$/.test(contactId)) return null;
      const expected = Buffer.from(mac(contactId));
      const actual = Buffer.from(given);
      return expected.length === actual.length && timingSafeEqual(expected, actual) ? contactId : null;
    },
  };
}
export type NewsTokens = ReturnType<typeof newsTokens>;
