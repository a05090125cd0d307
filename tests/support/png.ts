import { crc32 } from "node:zlib";

/**
 * The smallest PNG of a given size, as the PNG specification (W3C, 2nd edition, 5.2 and 11.2.2) lays
 * one out: the signature, an IHDR chunk with the width and height, and IEND. Enough for any reader of
 * the header; it holds no picture.
 */
export function png(width: number, height: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, "ascii"), data]);
    const length = Buffer.alloc(4);
    length.writeUInt32BE(data.length);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(body));
    return Buffer.concat([length, body, crc]);
  };
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header.set([8, 2, 0, 0, 0], 8);
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk("IHDR", header), chunk("IEND", Buffer.alloc(0))]);
}
