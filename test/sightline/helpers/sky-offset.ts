/**
 * Point at angular distance sepDeg and position angle paDeg (north through east) from (raDeg, decDeg):
 * the spherical "destination point" formula (common practice, spherical trigonometry).
 */
export function offsetPoint(raDeg: number, decDeg: number, sepDeg: number, paDeg: number): [number, number] {
  const d2r = Math.PI / 180;
  const d1 = decDeg * d2r;
  const t = sepDeg * d2r;
  const pa = paDeg * d2r;
  const sinDec2 = Math.sin(d1) * Math.cos(t) + Math.cos(d1) * Math.sin(t) * Math.cos(pa);
  const dec2 = Math.asin(Math.max(-1, Math.min(1, sinDec2)));
  const dRa = Math.atan2(Math.sin(pa) * Math.sin(t) * Math.cos(d1), Math.cos(t) - Math.sin(d1) * sinDec2);
  let ra2 = (raDeg + dRa / d2r) % 360;
  if (ra2 < 0) ra2 += 360;
  if (ra2 >= 360) ra2 -= 360;
  return [ra2, dec2 / d2r];
}
