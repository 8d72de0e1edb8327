// Carlson's symmetric elliptic integral of the second kind, R_D(x, y, z) = (3/2) ∫₀^∞ dt / ((t+z)√((t+x)(t+y)(t+z))),
// by the duplication theorem (B. C. Carlson, "Numerical computation of real or complex elliptic integrals",
// Numerical Algorithms 10, 1995, 13–26; the loop and series as in Press et al., Numerical Recipes, 3rd ed.,
// 2007, §6.12, routine rd, whose tolerance 0.0015 gives full double precision).

const ERRTOL = 0.0015;
const C1 = 3 / 14;
const C2 = 1 / 6;
const C3 = 9 / 22;
const C4 = 3 / 26;
const C5 = 0.25 * C3;
const C6 = 1.5 * C4;

export function carlsonRD(x: number, y: number, z: number): number {
  if (Math.min(x, y) < 0 || Math.min(x + y, z) <= 0) {
    throw new RangeError(`carlsonRD: needs x, y ≥ 0, x + y > 0 and z > 0, got ${x}, ${y}, ${z}`);
  }
  let xt = x;
  let yt = y;
  let zt = z;
  let sum = 0;
  let fac = 1;
  let ave: number;
  let delx: number;
  let dely: number;
  let delz: number;
  do {
    const sx = Math.sqrt(xt);
    const sy = Math.sqrt(yt);
    const sz = Math.sqrt(zt);
    const lambda = sx * (sy + sz) + sy * sz;
    sum += fac / (sz * (zt + lambda));
    fac *= 0.25;
    xt = 0.25 * (xt + lambda);
    yt = 0.25 * (yt + lambda);
    zt = 0.25 * (zt + lambda);
    ave = 0.2 * (xt + yt + 3 * zt);
    delx = (ave - xt) / ave;
    dely = (ave - yt) / ave;
    delz = (ave - zt) / ave;
  } while (Math.max(Math.abs(delx), Math.abs(dely), Math.abs(delz)) > ERRTOL);
  const ea = delx * dely;
  const eb = delz * delz;
  const ec = ea - eb;
  const ed = ea - 6 * eb;
  const ee = ed + ec + ec;
  return (
    3 * sum +
    (fac *
      (1 + ed * (-C1 + C5 * ed - C6 * delz * ee) + delz * (C2 * ee + delz * (-C3 * ec + delz * C4 * ea)))) /
      (ave * Math.sqrt(ave))
  );
}
