/** Tolerances of the panel operations, in one place (mm unless named otherwise). */

/** Style-line ends farther than this from the outline are refused; nearer ones are snapped onto it. */
export const STYLE_LINE_SNAP_MM = 2;
/** Seam edges within this of each other are the same edge (join snaps them; beyond it refuses). */
export const SEAM_SNAP_MM = 0.05;
/** A point counts as on an outline or path within this. */
export const ON_LINE_MM = 1e-3;
/** A style line passing this close to a divergence point reaches it. */
export const REACH_MM = 0.5;
/** Shortest style line accepted. */
export const MIN_STYLE_LINE_MM = 1;
/** Default seam allowance (reference-values.md row 21: 10 mm common alternative, S). */
export const DEFAULT_ALLOWANCE_MM = 10;
/** Truing tolerance: 1/16 in (reference-values.md row 25, C/P). */
export const TRUING_TOLERANCE_MM = 25.4 / 16;
/** A cut end this close to an outline vertex is moved onto the vertex (kernel refuses segments < 0.01 mm). */
export const VERTEX_SNAP_MM = 0.1;
