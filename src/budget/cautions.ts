/** Scientific cautions stated with every budget output (model dependence and validity ranges). */
export const BUDGET_CAUTIONS: readonly string[] = Object.freeze([
  'The Macquart relation is a mean over sightlines; its normalisation depends on Ω_b H0, on f_d (or f_igm) and on the helium ionisation history, all model inputs.',
  'The cosmic-DM PDF of Macquart et al. 2020 is a fitted shape; F (default 0.32, recalled not re-read) sets its width and is uncertain; σ_DM = F z^(−1/2) is a width, not a standard deviation.',
  'Milky Way ISM and halo terms come from Galactic models or priors that can be wrong by a factor of ~2 on some sightlines (common practice).',
  'Foreground-halo DMs depend on the stellar-to-halo mass relation, concentration and hot-gas profile chosen; they are model estimates, not measurements.',
  'DM_host,rest is what remains after subtracting everything else; it absorbs every error of the other terms, and negative values signal tension, not negative electron columns.',
]);
