// A reader of the Content-Disposition header written for the tests from the RFCs, not from our encoder:
// RFC 6266 section 4.1 (disposition-type, parameters as token or quoted-string) and RFC 8187 section 3.2
// (ext-value = charset "'" [language] "'" value-chars, value-chars = *( pct-encoded / attr-char )).

const TOKEN = /^[!#$%&'*+\-.^_`|~0-9A-Za-z]+/;
const ATTR_CHAR = /^[!#$&+\-.^_`|~0-9A-Za-z]$/;

export interface Disposition {
  type: string;
  params: Map<string, string>;
}

/** The header's type and parameters (names lower-cased); throws on anything the grammar does not allow. */
export function parseDisposition(header: string): Disposition {
  let rest = header;
  const take = (pattern: RegExp): string => {
    const m = pattern.exec(rest);
    if (!m) throw new Error(`unexpected ${JSON.stringify(rest.slice(0, 20))} in ${JSON.stringify(header)}`);
    rest = rest.slice(m[0].length);
    return m[0];
  };
  const type = take(TOKEN).toLowerCase();
  const params = new Map<string, string>();
  while (rest.length > 0) {
    take(/^\s*;\s*/);
    const name = take(TOKEN).toLowerCase();
    take(/^\s*=\s*/);
    let value: string;
    if (rest.startsWith('"')) {
      // qdtext excludes the controls (RFC 9110 section 5.6.4): matching them is the point here.
      // eslint-disable-next-line no-control-regex
      const quoted = take(/^"((?:[^"\\\x00-\x1f\x7f]|\\[\x20-\x7e])*)"/);
      value = quoted.slice(1, -1).replace(/\\(.)/g, '$1');
    } else value = take(TOKEN);
    if (params.has(name)) throw new Error(`parameter ${name} given twice`);
    params.set(name, value);
  }
  return { type, params };
}

/** The text of an RFC 8187 ext-value in UTF-8; throws on another charset, a bad escape or bad UTF-8. */
export function decodeExtValue(extValue: string): string {
  const m = /^([^']*)'([^']*)'(.*)$/.exec(extValue);
  if (!m || m[1]?.toLowerCase() !== 'utf-8') throw new Error(`not a UTF-8 ext-value: ${extValue}`);
  const chars = m[3] ?? '';
  const bytes: number[] = [];
  for (let k = 0; k < chars.length;) {
    const c = chars[k] ?? '';
    if (c === '%') {
      const hex = chars.slice(k + 1, k + 3);
      if (!/^[0-9A-Fa-f]{2}$/.test(hex)) throw new Error(`bad escape at ${k} in ${extValue}`);
      bytes.push(parseInt(hex, 16));
      k += 3;
    } else {
      if (!ATTR_CHAR.test(c)) throw new Error(`${JSON.stringify(c)} is not an attr-char (${extValue})`);
      bytes.push(c.charCodeAt(0));
      k += 1;
    }
  }
  return new TextDecoder('utf-8', { fatal: true }).decode(new Uint8Array(bytes));
}

/** The name a client offers: filename* when given (RFC 6266 section 4.3), with its ASCII fallback. */
export function attachmentName(header: string): { name: string; fallback: string } {
  const { type, params } = parseDisposition(header);
  if (type !== 'attachment') throw new Error(`not an attachment: ${header}`);
  const fallback = params.get('filename');
  const star = params.get('filename*');
  if (fallback === undefined || star === undefined)
    throw new Error(`filename and filename* expected: ${header}`);
  return { name: decodeExtValue(star), fallback };
}
