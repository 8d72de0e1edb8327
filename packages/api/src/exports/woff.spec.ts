import { describe, expect, it } from 'vitest';
import { latoWoff } from './fonts';
import { sfntTableChecksum, woffToSfnt } from './woff';

describe('woffToSfnt', () => {
  it('woffToSfnt() restores every table so that its checksum matches the one the WOFF recorded', () => {
    const woff = latoWoff('regular');
    const sfnt = woffToSfnt(woff);
    const numTables = sfnt.readUInt16BE(4);
    expect(numTables).toBe(woff.readUInt16BE(12));
    // TrueType outlines: sfnt version 0x00010000 (OpenType spec, "Organization of an OpenType font").
    expect(sfnt.readUInt32BE(0)).toBe(0x00010000);
    const tags: string[] = [];
    for (let i = 0; i < numTables; i++) {
      const at = 12 + 16 * i;
      const tag = sfnt.toString('latin1', at, at + 4);
      tags.push(tag);
      const table = sfnt.subarray(
        sfnt.readUInt32BE(at + 8),
        sfnt.readUInt32BE(at + 8) + sfnt.readUInt32BE(at + 12),
      );
      // The head table's checksum is taken with checksumAdjustment zeroed (OpenType spec, "head").
      if (tag === 'head') {
        const zeroed = Buffer.from(table);
        zeroed.writeUInt32BE(0, 8);
        expect(sfntTableChecksum(zeroed), tag).toBe(sfnt.readUInt32BE(at + 4));
      } else expect(sfntTableChecksum(table), tag).toBe(sfnt.readUInt32BE(at + 4));
    }
    expect(tags).toEqual([...tags].sort());
    expect(tags).toEqual(
      expect.arrayContaining(['cmap', 'glyf', 'head', 'hhea', 'hmtx', 'loca', 'maxp', 'name']),
    );
  });

  it('woffToSfnt() refuses a file that is not WOFF 1.0', () => {
    expect(() => woffToSfnt(Buffer.from('wOF2 not this one, 44 bytes long at least....'))).toThrow(
      /not a WOFF 1.0/,
    );
  });
});
