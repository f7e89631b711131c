/**
 * Position → nested pixel index, written from the HEALPix projection of Górski et al. 2005
 * (ApJ 622, 759, §4, eqs. 4–8 (from memory)): the equatorial zone |z| ≤ 2/3 is cut by two families of
 * straight lines in (φ, z); each polar cap by lines in (φ, √(3(1−|z|))). Each base pixel ("face")
 * holds an Nside × Nside grid (ix toward north-east, iy toward north-west, from the south corner),
 * and the nested index interleaves the bits of ix (even bits) and iy (odd bits).
 *
 * Own code rather than @hscmap/healpix `ang2pix_nest`: that function (1.4.12) puts points lying at φ
 * = 90°·k just inside a polar cap into the wrong face (e.g. (90°, +41.810317°) lands next to the north
 * pole). Edge conventions follow healpy, so points on pixel edges fall the same way (test/sky).
 */

const TWO_OVER_PI = 2 / Math.PI;

/** Spread the low 16 bits of v to the even bit positions (bit i → bit 2i). */
function spreadBits(v: number): number {
  let x = v & 0xffff;
  x = (x | (x << 8)) & 0x00ff00ff;
  x = (x | (x << 4)) & 0x0f0f0f0f;
  x = (x | (x << 2)) & 0x33333333;
  x = (x | (x << 1)) & 0x55555555;
  return x >>> 0;
}

/** Nested index of face f, grid position (ix, iy) at resolution nside. */
export function faceXyToNest(nside: number, face: number, ix: number, iy: number): number {
  return face * nside * nside + (spreadBits(ix) + 2 * spreadBits(iy));
}

/**
 * Nested index at resolution nside of colatitude θ [rad] and longitude φ [rad, in [0, 2π)].
 * Near the poles (θ < 0.01 or > π − 0.01) the cap coordinate uses sin θ for precision, as healpy does.
 */
export function thetaPhiToNest(nside: number, theta: number, phi: number): number {
  const z = Math.cos(theta);
  const za = Math.abs(z);
  let tt = phi * TWO_OVER_PI; // in [0, 4)
  if (tt >= 4) tt -= 4;
  if (za <= 2 / 3) {
    const t1 = nside * (0.5 + tt);
    const t2 = nside * z * 0.75;
    const jp = Math.floor(t1 - t2); // index of the ascending edge line
    const jm = Math.floor(t1 + t2); // index of the descending edge line
    const ifp = Math.floor(jp / nside);
    const ifm = Math.floor(jm / nside);
    const face = ifp === ifm ? ifp | 4 : ifp < ifm ? ifp : ifm + 8;
    const ix = jm & (nside - 1);
    const iy = nside - (jp & (nside - 1)) - 1;
    return faceXyToNest(nside, face, ix, iy);
  }
  const ntt = Math.min(3, Math.floor(tt));
  const tp = tt - ntt;
  const nearPole = theta < 0.01 || theta > Math.PI - 0.01;
  const capScale = nearPole ? Math.sin(theta) * Math.sqrt(3 / (1 + za)) : Math.sqrt(3 * (1 - za));
  const tmp = nside * capScale;
  const jp = Math.min(nside - 1, Math.floor(tp * tmp));
  const jm = Math.min(nside - 1, Math.floor((1 - tp) * tmp));
  return z > 0
    ? faceXyToNest(nside, ntt, nside - jm - 1, nside - jp - 1)
    : faceXyToNest(nside, ntt + 8, jp, jm);
}

/** Gather the even bits of v (bit 2i → bit i); the inverse of spreadBits for v < 2^32. */
function compactBits(v: number): number {
  let x = v & 0x55555555;
  x = (x | (x >>> 1)) & 0x33333333;
  x = (x | (x >>> 2)) & 0x0f0f0f0f;
  x = (x | (x >>> 4)) & 0x00ff00ff;
  x = (x | (x >>> 8)) & 0x0000ffff;
  return x;
}

/** Ring of each face's southern corner in units of Nside, and its longitude in units of π/4 (Górski et al. 2005, Fig. 4). */
const FACE_RING = [2, 2, 2, 2, 3, 3, 3, 3, 4, 4, 4, 4];
const FACE_PHI = [1, 3, 5, 7, 0, 2, 4, 6, 1, 3, 5, 7];

/**
 * Centre of nested pixel ipix at resolution nside as a unit vector. The pixel's ring index from the
 * north pole and its position in the ring give z = cos θ and φ (Górski et al. 2005, §4: rings of
 * equal z; 4·i pixels per polar ring i, 4·Nside per equatorial ring, alternate rings shifted by half
 * a pixel). In the caps 1 − |z| = i²/(3Nside²) is formed directly, so sin θ stays precise at the poles.
 */
export function nestToVector(nside: number, ipix: number): [number, number, number] {
  const nside2 = nside * nside;
  const face = Math.floor(ipix / nside2);
  const k = ipix - face * nside2;
  const ix = compactBits(k);
  const iy = compactBits(k >>> 1);
  const ring = FACE_RING[face] * nside - ix - iy - 1; // 1 … 4·nside − 1 from the north pole
  let nr: number; // pixels in this ring / 4
  let z: number;
  let sinTheta: number;
  let shift: number;
  if (ring < nside) {
    nr = ring;
    const oneMinusZ = (nr * nr) / (3 * nside2);
    z = 1 - oneMinusZ;
    sinTheta = Math.sqrt(oneMinusZ * (2 - oneMinusZ));
    shift = 0;
  } else if (ring > 3 * nside) {
    nr = 4 * nside - ring;
    const onePlusZ = (nr * nr) / (3 * nside2);
    z = onePlusZ - 1;
    sinTheta = Math.sqrt(onePlusZ * (2 - onePlusZ));
    shift = 0;
  } else {
    nr = nside;
    z = ((2 * nside - ring) * 2) / (3 * nside);
    sinTheta = Math.sqrt((1 - z) * (1 + z));
    shift = (ring - nside) & 1;
  }
  let jp = (FACE_PHI[face] * nr + ix - iy + 1 + shift) / 2;
  if (jp > 4 * nside) jp -= 4 * nside;
  if (jp < 1) jp += 4 * nside;
  const phi = (jp - (shift + 1) * 0.5) * (Math.PI / 2 / nr);
  return [sinTheta * Math.cos(phi), sinTheta * Math.sin(phi), z];
}
