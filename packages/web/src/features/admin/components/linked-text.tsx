import { Link } from '@fluentui/react-components';
import { Fragment } from 'react';
import { RouterLink } from '@/components/router-link';

// A URL runs to the next space or quote; punctuation that ends a sentence is not part of it.
const URL_PATTERN = /https?:\/\/[^\s<>"']+/g;
const TRAILING_PUNCTUATION = /[.,;:!?)\]]+$/;

export type TextPart = { kind: 'text'; text: string } | { kind: 'link'; href: string };

/** Splits plain text into runs of text and the http(s) links inside it. */
export function splitLinks(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const href = match[0].replace(TRAILING_PUNCTUATION, '');
    const start = match.index;
    if (start > last) parts.push({ kind: 'text', text: text.slice(last, start) });
    parts.push({ kind: 'link', href });
    last = start + href.length;
  }
  if (last < text.length) parts.push({ kind: 'text', text: text.slice(last) });
  return parts;
}

/**
 * The client route a link points to when it is on this site (and not the API), so it can open inside
 * the app without a reload; null for any other address.
 */
export function clientRouteOf(href: string, origin: string): string | null {
  const url = new URL(href);
  if (url.origin !== origin || url.pathname === '/api' || url.pathname.startsWith('/api/')) return null;
  return `${url.pathname}${url.search}${url.hash}`;
}

/** Plain text with its links made real: a link into this app navigates with the router. */
export function LinkedText({ text }: { text: string }) {
  return (
    <>
      {splitLinks(text).map((part, index) => {
        if (part.kind === 'text') return <Fragment key={index}>{part.text}</Fragment>;
        const route = clientRouteOf(part.href, window.location.origin);
        return route === null ? (
          <Link key={index} href={part.href} target="_blank" rel="noopener noreferrer">
            {part.href}
          </Link>
        ) : (
          <RouterLink key={index} to={route}>
            {part.href}
          </RouterLink>
        );
      })}
    </>
  );
}
