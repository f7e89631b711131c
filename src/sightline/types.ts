/**
 * Inputs the sightline engine consumes. The catalogue query is injected (the store implements it),
 * so this package stays free of SQL and files. CatalogRow is the part of the store's GalaxyRow the
 * engine reads: a GalaxyRow can be passed as it is.
 */
import type { MassDefinition } from '../halo/index.js';

/** One catalogued galaxy (or catalogued group halo). Angles in degrees, masses in log₁₀ M☉. */
export interface CatalogRow {
  readonly catalog: string;
  readonly objectId: string;
  readonly raDeg: number;
  readonly decDeg: number;
  readonly z: number;
  /** 1σ redshift error (absolute); for photometric rows the Gaussian width of the photo-z. */
  readonly zErr: number | null;
  readonly zKind: 'spec' | 'photo';
  /** log₁₀(M* / M☉) (Chabrier IMF, as the SHMRs assume). */
  readonly logMstar: number | null;
  readonly logMstarErr: number | null;
  /** True when the store estimated the stellar mass from colours. */
  readonly massEstimated?: boolean;
  /** A catalogued halo mass (e.g. a group from member dynamics), used as given. */
  readonly logMhalo?: number | null;
  readonly mhaloDef?: MassDefinition | null;
  readonly logMhaloErr?: number | null;
  /** objectId of the row that stands for this galaxy's group halo. */
  readonly groupId?: string | null;
  /** Cross-catalogue duplicate link: rows sharing a key are one galaxy (default 'catalog/objectId'). */
  readonly physicalKey?: string | null;
}

/** A cone query on the catalogue store (synchronous: the store uses better-sqlite3). */
export interface ConeQuery {
  readonly raDeg: number;
  readonly decDeg: number;
  readonly radiusDeg: number;
  readonly catalogs?: readonly string[];
  /** Lowest catalogued redshift wanted (the engine filters again, so a store may ignore it). */
  readonly zMin?: number;
  readonly zMax?: number;
  /**
   * Optional hints for the wide cones of massive haloes: rows with log_mstar < minLogMstar and no
   * log_mhalo ≥ minLogMhalo are not needed. A store may ignore them (the engine selects exactly
   * afterwards); it must never drop a row that satisfies either bound.
   */
  readonly minLogMstar?: number;
  readonly minLogMhalo?: number;
}

export type ConeSearchFn = (query: ConeQuery) => readonly CatalogRow[];
