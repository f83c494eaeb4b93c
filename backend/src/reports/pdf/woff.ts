import { inflateSync } from 'node:zlib';

const WOFF_SIGNATURE = 0x774f4646; // 'wOFF'

/**
 * Unpacks a WOFF 1.0 font into the plain TrueType/OpenType file it wraps (W3C WOFF File Format 1.0, §4–5).
 * pdfkit can read WOFF itself, but inflates every table in JavaScript for every document; unpacking once
 * with Node's zlib makes each report several times faster.
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.readUInt32BE(0) !== WOFF_SIGNATURE) throw new Error('not a WOFF 1.0 font');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_, i) => {
    const entry = 44 + i * 20;
    const tag = woff.readUInt32BE(entry);
    const offset = woff.readUInt32BE(entry + 4);
    const compLength = woff.readUInt32BE(entry + 8);
    const origLength = woff.readUInt32BE(entry + 12);
    const checksum = woff.readUInt32BE(entry + 16);
    const stored = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(stored) : stored;
    if (data.length !== origLength) throw new Error('corrupt WOFF table');
    return { tag, checksum, data };
  });

  const power = 2 ** Math.floor(Math.log2(numTables));
  const headerLength = 12 + 16 * numTables;
  const padded = (length: number) => (length + 3) & ~3;
  const sfnt = Buffer.alloc(headerLength + tables.reduce((sum, t) => sum + padded(t.data.length), 0));
  sfnt.writeUInt32BE(flavor, 0);
  sfnt.writeUInt16BE(numTables, 4);
  sfnt.writeUInt16BE(power * 16, 6);
  sfnt.writeUInt16BE(Math.log2(power), 8);
  sfnt.writeUInt16BE(numTables * 16 - power * 16, 10);
  let offset = headerLength;
  tables.forEach((table, i) => {
    const record = 12 + i * 16;
    sfnt.writeUInt32BE(table.tag, record);
    sfnt.writeUInt32BE(table.checksum, record + 4);
    sfnt.writeUInt32BE(offset, record + 8);
    sfnt.writeUInt32BE(table.data.length, record + 12);
    table.data.copy(sfnt, offset);
    offset += padded(table.data.length);
  });
  return sfnt;
}
