// Plain 3-vectors and 3×3 matrices (row-major), enough for frame rotations without a matrix library.

export type Vec3 = readonly [number, number, number];
export type Mat3 = readonly [Vec3, Vec3, Vec3];

export function add(a: Vec3, b: Vec3): Vec3 {
  return [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
}

export function sub(a: Vec3, b: Vec3): Vec3 {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}

export function scale(a: Vec3, k: number): Vec3 {
  return [a[0] * k, a[1] * k, a[2] * k];
}

export function dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

export function norm(a: Vec3): number {
  return Math.hypot(a[0], a[1], a[2]);
}

export function unit(a: Vec3): Vec3 {
  return scale(a, 1 / norm(a));
}

export function mulMatVec(m: Mat3, v: Vec3): Vec3 {
  return [dot(m[0], v), dot(m[1], v), dot(m[2], v)];
}

/** Unit vector of right ascension and declination (radians) in the frame they refer to. */
export function fromRaDec(raRad: number, decRad: number): Vec3 {
  const c = Math.cos(decRad);
  return [c * Math.cos(raRad), c * Math.sin(raRad), Math.sin(decRad)];
}

/** Right ascension in [0, 2π) and declination of a non-zero vector, radians. */
export function toRaDec(v: Vec3): { raRad: number; decRad: number } {
  const ra = Math.atan2(v[1], v[0]);
  return { raRad: ra < 0 ? ra + 2 * Math.PI : ra, decRad: Math.atan2(v[2], Math.hypot(v[0], v[1])) };
}
