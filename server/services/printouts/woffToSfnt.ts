import { inflateSync } from 'node:zlib';

/**
 * Unpacks a WOFF 1.0 font into the plain TrueType/OpenType file it wraps (W3C WOFF 1.0: a header
 * and a table directory, each table zlib-compressed unless that would not shrink it). fontkit can
 * read WOFF itself but inflates a table again on every glyph it looks up, which made a page of
 * text cost hundreds of milliseconds; the unpacked file is read once per process.
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.toString('latin1', 0, 4) !== 'wOFF') throw new Error('Not a WOFF 1.0 font.');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_, i) => {
    const at = 44 + i * 20;
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const raw = woff.subarray(offset, offset + compLength);
    return {
      tag: woff.subarray(at, at + 4),
      checksum: woff.readUInt32BE(at + 16),
      data: compLength < origLength ? inflateSync(raw) : raw,
    };
  });
  const padded = (n: number) => (n + 3) & ~3;
  const headerSize = 12 + 16 * numTables;
  const out = Buffer.alloc(headerSize + tables.reduce((sum, t) => sum + padded(t.data.length), 0));
  // The SFNT header's binary-search fields (OpenType spec, "Organization of an OpenType Font").
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  let offset = headerSize;
  tables.forEach((t, i) => {
    const record = 12 + i * 16;
    t.tag.copy(out, record);
    out.writeUInt32BE(t.checksum, record + 4);
    out.writeUInt32BE(offset, record + 8);
    out.writeUInt32BE(t.data.length, record + 12);
    t.data.copy(out, offset);
    offset += padded(t.data.length);
  });
  return out;
}
