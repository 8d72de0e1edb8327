// Map colours; the lines and bands take the Okabe–Ito colours of the station looks
// (src/components/station-look.ts). Every meaning carried by colour is also carried by a line style or a
// shade, which the legend shows.
export const mapPalette = {
  ocean: '#f3f7fa',
  land: '#e6e2d6',
  border: '#aaa596',
  graticule: '#d3dde0',
  night: '#1d2b3a',
  central: '#000000',
  limit: '#0072B2', // blue
  ring: '#CC79A7', // reddish purple
  band: '#56B4E9', // sky blue
  tick: '#3b4a4f',
} as const;
