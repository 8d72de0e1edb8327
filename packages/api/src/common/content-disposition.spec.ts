import { describe, expect, it } from 'vitest';
import { attachmentDisposition } from './content-disposition';

describe('attachmentDisposition()', () => {
  it('attachmentDisposition() encodes the UTF-8 name as RFC 5987 section 3.2.2 shows for "£ and € rates"', () => {
    // RFC 5987, section 3.2.2: title*=UTF-8''%c2%a3%20and%20%e2%82%ac%20rates (hex digits in either case).
    const header = attachmentDisposition('£ and € rates');
    expect(header.toLowerCase()).toBe(
      `attachment; filename="_ and _ rates"; filename*=utf-8''%c2%a3%20and%20%e2%82%ac%20rates`,
    );
  });

  it("attachmentDisposition() percent-encodes ' ( ) * (not attr-chars, RFC 8187 section 3.2.1) and spells accents without them in the fallback", () => {
    expect(attachmentDisposition("Café (1)'*.csv")).toBe(
      `attachment; filename="Cafe (1)'*.csv"; filename*=UTF-8''Caf%C3%A9%20%281%29%27%2A.csv`,
    );
  });

  it('attachmentDisposition() gives a header Node accepts for any stored name, and the fallback name for an empty one', () => {
    for (const name of ['a\u0000b\u2028.csv', '"\\%.csv', '\ud83c', ''])
      expect(attachmentDisposition(name, 'light-curve.csv')).toMatch(/^[\x20-\x7e]+$/);
    expect(attachmentDisposition('\u0000', 'light-curve.csv')).toBe(
      `attachment; filename="light-curve.csv"; filename*=UTF-8''light-curve.csv`,
    );
  });
});
