import { Card, makeStyles, Title2, tokens } from '@fluentui/react-components';
import type { ReactNode } from 'react';
import { LimbusLogo } from './logo';
import { PRODUCT_NAME } from '@/config/product';

const useStyles = makeStyles({
  page: {
    minHeight: '100vh',
    display: 'flex',
    alignItems: 'center',
    justifyContent: 'center',
    padding: tokens.spacingHorizontalL,
    boxSizing: 'border-box',
    backgroundColor: tokens.colorNeutralBackground2,
  },
  card: { width: '100%', maxWidth: '420px', padding: tokens.spacingHorizontalXXL },
  brand: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalS },
});

/** The frame of the signed-out pages: sign-in, invitations, password reset. */
export function AuthCard({ title, children }: { title: string; children: ReactNode }) {
  const styles = useStyles();
  return (
    <main className={styles.page}>
      <Card className={styles.card}>
        <div className={styles.brand}>
          <LimbusLogo sizePx={36} />
          <span aria-hidden="true">{PRODUCT_NAME}</span>
        </div>
        <Title2 as="h1">{title}</Title2>
        {children}
      </Card>
    </main>
  );
}
