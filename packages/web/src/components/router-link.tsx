import { Link } from '@fluentui/react-components';
import type { ReactNode } from 'react';
import { useHref, useLinkClickHandler } from 'react-router-dom';

// Fluent's Link styled, react-router's navigation: a real href (middle-click, copy link) without a reload.
export function RouterLink({ to, children }: { to: string; children: ReactNode }) {
  const href = useHref(to);
  const onClick = useLinkClickHandler<HTMLAnchorElement>(to);
  return (
    <Link href={href} onClick={onClick}>
      {children}
    </Link>
  );
}
