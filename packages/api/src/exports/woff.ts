// WOFF 1.0 to a plain sfnt (TrueType/OpenType) file. The rasteriser's font loader reads sfnt only, and the
// one Lato package on the registry ships WOFF and WOFF2; WOFF 1.0 is the sfnt with each table optionally
// zlib-compressed, so undoing it is a table copy. Layout from W3C, "WOFF File Format 1.0",
// Recommendation 13 December 2012, sections 3 (header), 4 (table directory) and 5 (table data).
import { inflateSync } from 'node:zlib';

const WOFF_SIGNATURE = 0x774f4646; // 'wOFF'
const WOFF_HEADER_BYTES = 44;
const WOFF_ENTRY_BYTES = 20;
const SFNT_HEADER_BYTES = 12;
const SFNT_ENTRY_BYTES = 16;

interface TableEntry {
  tag: number;
  data: Buffer;
  checksum: number;
}

function padded4(n: number): number {
  return (n + 3) & ~3;
}

/** The sfnt table checksum: the sum of the table's big-endian uint32 words, zero-padded (OpenType spec, "Calculating checksums"). */
export function sfntTableChecksum(data: Buffer): number {
  let sum = 0;
  const whole = data.length & ~3;
  for (let i = 0; i < whole; i += 4) sum = (sum + data.readUInt32BE(i)) >>> 0;
  if (whole < data.length) {
    const tail = Buffer.alloc(4);
    data.copy(tail, 0, whole);
    sum = (sum + tail.readUInt32BE(0)) >>> 0;
  }
  return sum;
}

export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.length < WOFF_HEADER_BYTES || woff.readUInt32BE(0) !== WOFF_SIGNATURE)
    throw new Error('not a WOFF 1.0 file (signature wOFF missing)');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: TableEntry[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = WOFF_HEADER_BYTES + i * WOFF_ENTRY_BYTES;
    const tag = woff.readUInt32BE(at);
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const checksum = woff.readUInt32BE(at + 16);
    const stored = woff.subarray(offset, offset + compLength);
    // Section 5: a table is stored uncompressed exactly when compLength equals origLength.
    const data = compLength < origLength ? inflateSync(stored) : Buffer.from(stored);
    if (data.length !== origLength)
      throw new Error(`WOFF table ${i} inflates to ${data.length} bytes, expected ${origLength}`);
    tables.push({ tag, data, checksum });
  }
  // The sfnt directory must be sorted by tag (OpenType spec, "Table directory").
  tables.sort((a, b) => a.tag - b.tag);
  let size = SFNT_HEADER_BYTES + numTables * SFNT_ENTRY_BYTES;
  const offsets = tables.map((t) => {
    const at = size;
    size += padded4(t.data.length);
    return at;
  });
  const out = Buffer.alloc(size);
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  tables.forEach((t, i) => {
    const at = SFNT_HEADER_BYTES + i * SFNT_ENTRY_BYTES;
    const offset = offsets[i] as number;
    out.writeUInt32BE(t.tag, at);
    out.writeUInt32BE(t.checksum, at + 4);
    out.writeUInt32BE(offset, at + 8);
    out.writeUInt32BE(t.data.length, at + 12);
    t.data.copy(out, offset);
  });
  return out;
}
