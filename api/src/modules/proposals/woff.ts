// WOFF 1.0 → TrueType (sfnt), so pdfmake's font reader works on plain tables: read from the
// .woff file each time, its zlib-compressed tables made a proposal take ~20× longer.
// Format: W3C "WOFF File Format 1.0" (2012), §3–§5 (header, table directory, sfnt layout).
import { inflateSync } from 'node:zlib';

/** The sfnt (TrueType/OpenType) font inside a WOFF 1.0 file. */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.length < 44 || woff.toString('latin1', 0, 4) !== 'wOFF')
    throw new RangeError('not a WOFF 1.0 file');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  if (numTables === 0 || 44 + numTables * 20 > woff.length)
    throw new RangeError('WOFF table directory out of bounds');
  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = 44 + i * 20;
    const tag = woff.readUInt32BE(at);
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const checksum = woff.readUInt32BE(at + 16);
    if (offset + compLength > woff.length) throw new RangeError('WOFF table out of bounds');
    const raw = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(raw) : Buffer.from(raw);
    if (data.length !== origLength) throw new RangeError('WOFF table of the wrong length');
    tables.push({ tag, checksum, data });
  }
  const pad = (n: number): number => (n + 3) & ~3;
  const headerSize = 12 + 16 * numTables;
  const size = tables.reduce((sum, t) => sum + pad(t.data.length), headerSize);
  const out = Buffer.alloc(size);
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  let offset = headerSize;
  tables.forEach((t, i) => {
    const rec = 12 + i * 16;
    out.writeUInt32BE(t.tag, rec);
    out.writeUInt32BE(t.checksum, rec + 4);
    out.writeUInt32BE(offset, rec + 8);
    out.writeUInt32BE(t.data.length, rec + 12);
    t.data.copy(out, offset);
    offset += pad(t.data.length);
  });
  return out;
}
