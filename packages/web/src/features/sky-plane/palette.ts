// Plot colours from the Okabe–Ito palette, chosen to stay distinct for the common forms of colour-vision
// deficiency: M. Okabe and K. Ito, "Color Universal Design (CUD): how to make figures and presentations
// that are friendly to colorblind people" (2002, revised 2008), jfly.uni-koeln.de/color. Every meaning
// carried by colour is also carried by a line style or marker shape.
export const plotPalette = {
  positiveChord: '#0072B2', // blue
  negativeChord: '#D55E00', // vermillion
  limb: '#000000', // black
  band: '#56B4E9', // sky blue
  ring: '#CC79A7', // reddish purple
  ringCrossing: '#E69F00', // orange
  centre: '#009E73', // bluish green
  axis: '#3b4a4f',
  grid: '#d9e2e4',
} as const;
