import { describe, expect, it } from 'vitest';
import { escapeXml, printableText } from './svg-text';

describe('printableText()', () => {
  it('printableText() drops what XML 1.0 forbids (section 2.2, Char) and DEL/C1, and keeps tab, newlines and other scripts', () => {
    expect(printableText('Quillon\u0000 \u001b[31m\u007f\u0085 κύκλος 🌑\t\n\r')).toBe(
      'Quillon [31m κύκλος 🌑\t\n\r',
    );
    expect(printableText('a\uffffb\ufffe')).toBe('ab');
    expect(printableText('lone \ud83c and \udf11 halves')).toBe('lone  and  halves');
  });

  it('escapeXml() escapes the markup characters after dropping the forbidden ones', () => {
    expect(escapeXml('<R1 & "R2">\u0000')).toBe('&lt;R1 &amp; &quot;R2&quot;&gt;');
  });
});
