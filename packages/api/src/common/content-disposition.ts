// The one way a download names its file (RFC 6266): `attachment`, an ASCII `filename` for old clients
// and the exact name as UTF-8 in `filename*` (RFC 8187, which replaced RFC 5987). Every download route
// sets its header here, so a stored name with any character answers a valid header, never a 500.
import { safeFileName } from '@limbus/schema';
import type { Response } from 'express';

/** Characters RFC 8187 allows unencoded in a value (attr-char); encodeURIComponent also leaves ' ( ) *. */
function encodeExtValue(text: string): string {
  return encodeURIComponent(text).replace(
    /['()*]/g,
    (c) => `%${c.charCodeAt(0).toString(16).toUpperCase().padStart(2, '0')}`,
  );
}

/**
 * The name in printable ASCII: letters lose their accents (NFKD, then the combining marks go), anything
 * else outside U+0020–U+007E becomes "_", and so do the quote, the backslash and "%", which some
 * clients would read as an escape.
 */
function asciiFallback(name: string): string {
  return name
    .normalize('NFKD')
    .replace(/\p{M}/gu, '')
    .replace(/[^\x20-\x7e]|["\\%]/gu, '_');
}

/** `attachment; filename="<ASCII>"; filename*=UTF-8''<percent-encoded>` for a file offered as `name`. */
export function attachmentDisposition(name: string, fallback = 'download'): string {
  const safe = safeFileName(name, fallback);
  return `attachment; filename="${asciiFallback(safe)}"; filename*=UTF-8''${encodeExtValue(safe)}`;
}

export function setAttachment(res: Response, name: string, fallback?: string): void {
  res.setHeader('Content-Disposition', attachmentDisposition(name, fallback));
}
