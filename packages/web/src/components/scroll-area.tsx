import { makeStyles, mergeClasses, Text, tokens } from '@fluentui/react-components';
import { useCallback, useEffect, useRef, useState, type ReactNode } from 'react';

const useStyles = makeStyles({
  wrap: { position: 'relative', maxWidth: '100%' },
  scroll: { overflowX: 'auto', maxWidth: '100%' },
  // Shadows at the edges that still have content beyond them, so a cut-off table or tab list shows it.
  fadeStart: {
    boxShadow: `inset 12px 0 10px -10px ${tokens.colorNeutralShadowAmbient}`,
  },
  fadeEnd: {
    boxShadow: `inset -12px 0 10px -10px ${tokens.colorNeutralShadowAmbient}`,
  },
  fadeBoth: {
    boxShadow: `inset 12px 0 10px -10px ${tokens.colorNeutralShadowAmbient}, inset -12px 0 10px -10px ${tokens.colorNeutralShadowAmbient}`,
  },
  hint: { display: 'block', color: tokens.colorNeutralForeground3, marginTop: tokens.spacingVerticalXXS },
});

/**
 * A horizontally scrolling box for wide tables and tab lists. When its content is wider than the
 * screen it says so (a shaded edge on each side with more content, and a line of text below), because
 * a bare scrollbar is easy to miss on a narrow screen.
 */
export function ScrollArea({ children, label }: { children: ReactNode; label: string }) {
  const styles = useStyles();
  const ref = useRef<HTMLDivElement>(null);
  const [edges, setEdges] = useState({ before: false, after: false });

  const measure = useCallback(() => {
    const el = ref.current;
    if (el === null) return;
    const before = el.scrollLeft > 1;
    const after = el.scrollLeft + el.clientWidth < el.scrollWidth - 1;
    setEdges((old) => (old.before === before && old.after === after ? old : { before, after }));
  }, []);

  useEffect(() => {
    measure();
    const el = ref.current;
    if (el === null || typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(measure);
    observer.observe(el);
    if (el.firstElementChild) observer.observe(el.firstElementChild);
    return () => observer.disconnect();
  }, [measure]);

  const fade =
    edges.before && edges.after
      ? styles.fadeBoth
      : edges.before
        ? styles.fadeStart
        : edges.after
          ? styles.fadeEnd
          : undefined;
  return (
    <div className={styles.wrap}>
      <div
        ref={ref}
        className={mergeClasses(styles.scroll, fade)}
        onScroll={measure}
        role="region"
        aria-label={label}
        // A scrolling region must be reachable by keyboard to be scrolled without a mouse.
        tabIndex={edges.before || edges.after ? 0 : undefined}
      >
        {children}
      </div>
      {edges.before || edges.after ? (
        <Text size={200} className={styles.hint}>
          {edges.after ? 'Scroll sideways for more →' : '← Scroll back for the first columns'}
        </Text>
      ) : null}
    </div>
  );
}
