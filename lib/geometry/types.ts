import type { GeometryWarning } from "./errors";

export type Vec3 = [number, number, number];

/** File layouts the readers understand. */
export type CloudFormat =
  | "ply-ascii"
  | "ply-binary-le"
  | "ply-binary-be"
  | "stl-ascii"
  | "stl-binary"
  | "xyz";

export type LengthUnit = "mm" | "in";

/**
 * A digitized surface held as flat typed arrays (never one object per point).
 * Coordinates are always millimetres after reading (`units: "in"` is converted on the way in).
 * Float32 keeps 5 M points at 60 MB; its ~7 significant digits are ~0.00003 mm at 500 mm.
 */
export type PointCloud = {
  /** x0 y0 z0 x1 y1 z1 …, exactly 3·count long. */
  positions: Float32Array;
  count: number;
  /** Triangle vertex indices, 3 per triangle (polygons are fan-split). STL: 0,1,2,3,4,5,… */
  faces?: Uint32Array;
  format: CloudFormat;
  warnings: GeometryWarning[];
};
