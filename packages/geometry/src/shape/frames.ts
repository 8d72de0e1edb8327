// Directions and frames for the shape model, all in the ICRF equatorial frame (x to RA 0, z to the
// celestial pole). A matrix is a row-major 3×3 array: m[3·i + j] is row i, column j.

export type Vec3 = [number, number, number];
export type Mat3 = [number, number, number, number, number, number, number, number, number];

export function unitVector(raRad: number, decRad: number): Vec3 {
  const c = Math.cos(decRad);
  return [c * Math.cos(raRad), c * Math.sin(raRad), Math.sin(decRad)];
}

export function dot(u: Vec3, v: Vec3): number {
  return u[0] * v[0] + u[1] * v[1] + u[2] * v[2];
}

/** The sky-plane basis of a star direction: f to the east, g to the north, s toward the star (f × g = s),
 * the fundamental plane of occultation work (common practice, no source). */
export function skyBasis(starRaRad: number, starDecRad: number): { f: Vec3; g: Vec3; s: Vec3 } {
  const [sa, ca, sd, cd] = [
    Math.sin(starRaRad),
    Math.cos(starRaRad),
    Math.sin(starDecRad),
    Math.cos(starDecRad),
  ];
  return {
    f: [-sa, ca, 0],
    g: [-sd * ca, -sd * sa, cd],
    s: [cd * ca, cd * sa, sd],
  };
}

export function multiply(m: Mat3, n: Mat3): Mat3 {
  const out = new Array<number>(9).fill(0) as Mat3;
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) {
      out[3 * i + j] = m[3 * i]! * n[j]! + m[3 * i + 1]! * n[3 + j]! + m[3 * i + 2]! * n[6 + j]!;
    }
  }
  return out;
}

export function rotationZ(angleRad: number): Mat3 {
  const [c, s] = [Math.cos(angleRad), Math.sin(angleRad)];
  return [c, -s, 0, s, c, 0, 0, 0, 1];
}

export function rotationX(angleRad: number): Mat3 {
  const [c, s] = [Math.cos(angleRad), Math.sin(angleRad)];
  return [1, 0, 0, 0, c, -s, 0, s, c];
}

/**
 * Body-to-equatorial rotation for a body whose pole points to (α₀, δ₀) and whose prime meridian is at
 * rotation angle W from the node of the body's equator on the celestial equator: M = R_z(α₀ + 90°)
 * R_x(90° − δ₀) R_z(W) (Archinal et al., "Report of the IAU Working Group on Cartographic Coordinates and
 * Rotational Elements: 2015", Celest. Mech. Dyn. Astr. 130:22, 2018, §2 and Fig. 1). Column i is body axis i.
 */
export function bodyToEquatorial(poleRaRad: number, poleDecRad: number, rotationAngleRad: number): Mat3 {
  return multiply(
    multiply(rotationZ(poleRaRad + Math.PI / 2), rotationX(Math.PI / 2 - poleDecRad)),
    rotationZ(rotationAngleRad),
  );
}

/** Column i of m, i.e. where body axis i points. */
export function column(m: Mat3, i: 0 | 1 | 2): Vec3 {
  return [m[i], m[3 + i]!, m[6 + i]!];
}
