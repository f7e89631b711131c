// Sequential colour ramp for DM: pale sand → amber → rust → plum (our own choice; monotonic in lightness).
const STOPS = [
  [0, [247, 240, 222]],
  [0.3, [236, 178, 92]],
  [0.6, [196, 86, 52]],
  [1, [84, 34, 88]],
];

/** Colour for t in [0, 1] as an rgb() string. */
export function rampColour(t) {
  const x = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  for (let i = 1; i < STOPS.length; i++) {
    const [t1, c1] = STOPS[i];
    const [t0, c0] = STOPS[i - 1];
    if (x <= t1) {
      const f = (x - t0) / (t1 - t0);
      const c = c0.map((v, k) => Math.round(v + f * (c1[k] - v)));
      return `rgb(${c[0]}, ${c[1]}, ${c[2]})`;
    }
  }
  return 'rgb(84, 34, 88)';
}
