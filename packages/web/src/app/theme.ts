import { createLightTheme, type BrandVariants, type Theme } from '@fluentui/react-components';

// Limbus brand ramp: deep teal running into ink at the dark end. Fluent uses shade 80 for primary
// buttons on light backgrounds, so that step is chosen to keep white text above 4.5:1 contrast.
const limbusBrand: BrandVariants = {
  10: '#020d10',
  20: '#05181d',
  30: '#08242b',
  40: '#0b3039',
  50: '#0e3c47',
  60: '#114955',
  70: '#145663',
  80: '#176371',
  90: '#2a7381',
  100: '#3e8390',
  110: '#53939f',
  120: '#6aa4ae',
  130: '#82b5bd',
  140: '#9cc6cc',
  150: '#b8d8dc',
  160: '#d5e9eb',
};

const base = createLightTheme(limbusBrand);

export const limbusTheme: Theme = {
  ...base,
  fontFamilyBase: "'Lato', 'Segoe UI', system-ui, sans-serif",
};
