import { describe, expect, it } from 'vitest';
import { acceptsMediaType, hasBody, mediaTypeOf } from './content-type.guard';

describe('content-type checks', () => {
  it('mediaTypeOf() keeps the type and subtype, lower-case, without parameters', () => {
    expect(mediaTypeOf('Application/JSON; charset=utf-8')).toBe('application/json');
    expect(mediaTypeOf('multipart/form-data; boundary=x')).toBe('multipart/form-data');
    expect(mediaTypeOf(undefined)).toBe('');
  });

  it('acceptsMediaType() takes application/<x>+json where JSON is taken (RFC 6839 section 3.1), nothing else', () => {
    expect(acceptsMediaType(['application/json'], 'application/json')).toBe(true);
    expect(acceptsMediaType(['application/json'], 'application/merge-patch+json')).toBe(true);
    expect(acceptsMediaType(['application/json'], 'text/plain')).toBe(false);
    expect(acceptsMediaType(['application/json'], 'text/json+json')).toBe(false);
    expect(acceptsMediaType(['multipart/form-data'], 'application/json')).toBe(false);
    expect(acceptsMediaType(['application/json'], '')).toBe(false);
  });

  it('hasBody() sees a body by a length above zero or a transfer coding (RFC 9112 section 6.3)', () => {
    expect(hasBody({ headers: { 'content-length': '12' } })).toBe(true);
    expect(hasBody({ headers: { 'transfer-encoding': 'chunked' } })).toBe(true);
    expect(hasBody({ headers: { 'content-length': '0' } })).toBe(false);
    expect(hasBody({ headers: {} })).toBe(false);
  });
});
