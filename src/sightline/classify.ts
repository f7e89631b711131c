import type { HaloKit } from './kit.js';
import { probabilityForeground } from './p-foreground.js';
import { redshiftSigma, velocityWindowDz } from './redshift-range.js';
import type { Candidate } from './search.js';

export interface Classified {
  /** In front with P ≥ model.p_fg_min, host excluded; `countable` false for members of a listed group halo. */
  readonly foreground: { cand: Candidate; countable: boolean }[];
  /** Catalogued z within ±Δz of z_s (and the host wherever it lies). */
  readonly environment: { cand: Candidate; isHost: boolean }[];
  /** Candidates with P(foreground) below the threshold and not in the environment. */
  readonly behind: number;
  readonly hostSeen: boolean;
}

/**
 * Split candidates: the named host (by id, any catalogue) is never foreground; catalogued redshifts
 * within ±Δz = (1+z_s)v/c of z_s form the burst environment (listed, not summed); galaxies with
 * P(z < z_s − Δz) ≥ p_fg_min are foreground (a photometric one may be both: listed in the environment
 * by its catalogued z and summed in the draws where it falls in front). A galaxy whose group_id names a
 * foreground row with a catalogued halo mass is counted through that group halo, not again.
 */
export function classifyCandidates(
  candidates: readonly Candidate[],
  kit: HaloKit,
  zSource: number,
  zSourceErr: number,
  hostId: string | undefined,
): Classified {
  const m = kit.model;
  const dz = velocityWindowDz(zSource, m.velocity_window_kms);
  const environment: Classified['environment'] = [];
  const fg: Candidate[] = [];
  let behind = 0;
  let hostSeen = false;
  for (const cand of candidates) {
    const row = cand.row;
    const isHost = hostId !== undefined && row.objectId === hostId;
    if (isHost) hostSeen = true;
    const inWindow = Math.abs(row.z - zSource) <= dz;
    if (isHost || inWindow) environment.push({ cand, isHost });
    if (isHost) continue;
    const p = probabilityForeground(row.z, redshiftSigma(row), zSource, zSourceErr, m.velocity_window_kms);
    if (p >= m.p_fg_min && p > 0) fg.push(cand);
    else if (!inWindow) behind++;
  }
  const groupHaloes = new Set<string>();
  const referenced = new Set(fg.map((c) => c.row.groupId).filter((g): g is string => !!g));
  for (const c of fg)
    if (c.halo.source === 'catalogue' && referenced.has(c.row.objectId)) groupHaloes.add(c.row.objectId);
  const foreground = fg.map((cand) => ({
    cand,
    countable: !(
      cand.row.groupId &&
      groupHaloes.has(cand.row.groupId) &&
      cand.row.objectId !== cand.row.groupId
    ),
  }));
  return { foreground, environment, behind, hostSeen };
}
