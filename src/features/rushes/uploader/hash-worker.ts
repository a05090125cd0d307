import { Sha256 } from "@shared/rushes/sha256";

/** Hashes a chosen file slice by slice off the page's thread; answers with the hex SHA-256. */
const SLICE = 8 * 1024 * 1024;

self.onmessage = async (event: MessageEvent<File>) => {
  const file = event.data;
  try {
    const hash = new Sha256();
    for (let at = 0; at < file.size; at += SLICE) hash.update(new Uint8Array(await file.slice(at, at + SLICE).arrayBuffer()));
    self.postMessage({ sha256: hash.hex() });
  } catch (error) {
    self.postMessage({ error: (error as Error).message });
  }
};
