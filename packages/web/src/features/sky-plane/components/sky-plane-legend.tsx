import { makeStyles, tokens } from '@fluentui/react-components';
import type { ReactNode } from 'react';
import { plotPalette } from '../palette';

const useStyles = makeStyles({
  list: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: `${tokens.spacingVerticalXS} ${tokens.spacingHorizontalL}`,
    listStyle: 'none',
    padding: 0,
    margin: `${tokens.spacingVerticalS} 0 0`,
    fontSize: tokens.fontSizeBase200,
  },
  item: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalXS },
});

function Swatch({ children }: { children: ReactNode }) {
  return (
    <svg width="28" height="12" viewBox="0 0 28 12" aria-hidden="true">
      {children}
    </svg>
  );
}

/** Says in words what each mark means, so no meaning rests on colour alone. */
export function SkyPlaneLegend({ hasBand, hasRings }: { hasBand: boolean; hasRings: boolean }) {
  const styles = useStyles();
  return (
    <ul className={styles.list} aria-label="Legend">
      <li className={styles.item}>
        <Swatch>
          <line x1="2" y1="6" x2="26" y2="6" stroke={plotPalette.positiveChord} strokeWidth="2.5" />
          <circle cx="4" cy="6" r="2.5" fill={plotPalette.positiveChord} />
          <circle cx="24" cy="6" r="2.5" fill={plotPalette.positiveChord} />
        </Swatch>
        Positive chord (solid, filled ends, timing error bars)
      </li>
      <li className={styles.item}>
        <Swatch>
          <line
            x1="4"
            y1="6"
            x2="24"
            y2="6"
            stroke={plotPalette.negativeChord}
            strokeWidth="1.5"
            strokeDasharray="4 3"
          />
          <circle cx="4" cy="6" r="3" fill="#ffffff" stroke={plotPalette.negativeChord} strokeWidth="1.5" />
          <circle cx="24" cy="6" r="3" fill="#ffffff" stroke={plotPalette.negativeChord} strokeWidth="1.5" />
        </Swatch>
        Negative chord (dashed, hollow ends)
      </li>
      <li className={styles.item}>
        <Swatch>
          <line x1="2" y1="6" x2="26" y2="6" stroke={plotPalette.limb} strokeWidth="1.5" />
        </Swatch>
        Fitted limb
      </li>
      {hasBand ? (
        <li className={styles.item}>
          <Swatch>
            <rect x="2" y="2" width="24" height="8" fill={plotPalette.band} fillOpacity="0.35" />
          </Swatch>
          1-sigma band
        </li>
      ) : null}
      {hasRings ? (
        <>
          <li className={styles.item}>
            <Swatch>
              <line
                x1="2"
                y1="6"
                x2="26"
                y2="6"
                stroke={plotPalette.ring}
                strokeWidth="1.5"
                strokeDasharray="8 3 2 3"
              />
            </Swatch>
            Ring
          </li>
          <li className={styles.item}>
            <Swatch>
              <path
                d="M14,1L19,6L14,11L9,6Z"
                fill={plotPalette.ringCrossing}
                stroke="#000000"
                strokeWidth="0.75"
              />
            </Swatch>
            Ring crossing
          </li>
        </>
      ) : null}
      <li className={styles.item}>
        <Swatch>
          <line x1="6" y1="6" x2="22" y2="6" stroke={plotPalette.centre} strokeWidth="2" />
          <line x1="14" y1="1" x2="14" y2="11" stroke={plotPalette.centre} strokeWidth="2" />
        </Swatch>
        Centre with 1-sigma error cross
      </li>
    </ul>
  );
}
