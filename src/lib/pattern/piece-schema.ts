import { z } from 'zod';

/**
 * An array typed readonly but not frozen. zod's `.readonly()` freezes what it parses, and V8 reads frozen
 * arrays on a slow path: one frozen outline through a kernel loop made every later loop in the process
 * five to six times slower. Pieces are still treated as immutable data throughout.
 */
function readonlyArray<T extends z.ZodType>(schema: z.ZodArray<T>): z.ZodReadonly<z.ZodArray<T>> {
	return schema as unknown as z.ZodReadonly<z.ZodArray<T>>;
}

/**
 * The piece model, as one zod schema shared by browser and server.
 * Units: millimetres, y pointing down, angles in radians. See README.md for the dart representation
 * (block darts: the wedge is cut out of the outline, legs run to the apex).
 */

const finite = () =>
	z.number().refine((n) => Number.isFinite(n), { message: 'must be a finite number' });

export const vecSchema = z.object({ x: finite(), y: finite() });

export const lineSegmentSchema = z.object({
	kind: z.literal('line'),
	p0: vecSchema,
	p1: vecSchema
});

export const cubicSegmentSchema = z.object({
	kind: z.literal('cubic'),
	p0: vecSchema,
	p1: vecSchema,
	p2: vecSchema,
	p3: vecSchema
});

export const segmentSchema = z.discriminatedUnion('kind', [lineSegmentSchema, cubicSegmentSchema]);

/** Closed net stitching line. */
export const outlineSchema = z.object({ segments: readonlyArray(z.array(segmentSchema).min(2)) });

/** Open path (internal lines, cap edges). */
export const pathSchema = z.object({ segments: readonlyArray(z.array(segmentSchema).min(1)) });

const idSchema = z.string().min(1).max(64);

/** Two points: a drawn straight line (fold line, placement line, arrow). */
export const lineMarkSchema = z.object({ from: vecSchema, to: vecSchema });

export const apexKindSchema = z.enum(['bust_point', 'dart_pivot', 'divergence']);

/** An apex: the point darts and pleats pivot about (bust point, back dart pivot, panel divergence). */
export const apexSchema = z.object({
	id: idSchema,
	kind: apexKindSchema,
	label: z.string().max(80).default(''),
	point: vecSchema
});

export const legSideSchema = z.enum(['leg1', 'leg2']);

/**
 * A dart. Its wedge is cut out of the outline: the outline runs … → leg1End → apex → leg2End → …
 * (leg1 comes before the apex in outline order). `movingLeg` is the side whose chain rotates in a
 * pivot (primer §1: "the chain from the moving leg L2 to S") when the piece has no fold line, centre
 * front label or grainline; with one, the side that holds it stays still (operations/still-side.ts).
 */
export const dartSchema = z.object({
	id: idSchema,
	apexId: idSchema,
	leg1End: vecSchema,
	leg2End: vecSchema,
	movingLeg: legSideSchema.default('leg2'),
	/** Side the sewn dart is pressed toward. */
	pressToward: legSideSchema.optional(),
	/** Sewn point pulled back from the apex along the bisector (primer §4). */
	pullBack: z
		.object({ clearanceMm: finite(), sewnPoint: vecSchema, sewnLegLengthMm: finite(), sewnAngleRad: finite() })
		.optional(),
	/** Trued cap across the dart mouth (primer §5): edges from leg1End to the peak to leg2End. */
	cap: z
		.object({ pressToward: legSideSchema, peak: vecSchema, edges: pathSchema })
		.optional()
});

export const pleatKindSchema = z.enum(['pleat', 'tuck']);

/**
 * A pleat or tuck opened at a seam: like a dart its opening is cut out of the outline
 * (… → leg1End → [pivot1] → apex → [pivot2] → leg2End → …). The two edges of the opening are the
 * fold line and the placement line; the fold is laid onto the placement line.
 */
export const pleatSchema = z.object({
	id: idSchema,
	apexId: idSchema,
	kind: pleatKindSchema,
	leg1End: vecSchema,
	leg2End: vecSchema,
	/** Substitute pivots (parallel pleats), on a small circle round the apex. */
	pivot1: vecSchema.optional(),
	pivot2: vecSchema.optional(),
	foldLine: lineMarkSchema,
	placementLine: lineMarkSchema,
	/** Side the fold is laid toward (= the placement line's side). */
	foldToward: legSideSchema,
	/** Arrow drawn on the piece: from the fold line toward the placement line, at the seam. */
	foldArrow: lineMarkSchema,
	intakeMm: finite(),
	depthMm: finite(),
	/** Tucks: length stitched from the seam before release. */
	stitchLengthMm: finite().optional()
});

export const notchSchema = z.object({
	id: idSchema,
	at: vecSchema,
	count: z.union([z.literal(1), z.literal(2)]).default(1)
});

export const grainlineSchema = z.object({
	from: vecSchema,
	to: vecSchema,
	arrowheads: z.enum(['both', 'one'])
});

export const internalLineSchema = z.object({
	id: idSchema,
	path: pathSchema,
	label: z.string().max(80).default('')
});

export const drillHoleSchema = z.object({
	id: idSchema,
	at: vecSchema,
	diameterMm: finite().default(3)
});

export const labelSchema = z.object({
	id: idSchema,
	text: z.string().max(200),
	at: vecSchema,
	angleRad: finite().default(0)
});

export const cutInstructionSchema = z.enum(['pair', 'single', 'on_fold']);

/**
 * Seam allowance added last (trade-primer §9): the widths asked for and the cut line they give. The
 * outline stays the net stitching line. Any later change of the outline drops it (it must be added again).
 */
/** How the allowance is shaped at a corner (see panels/allowance.ts): mitred, squared, or folded as pressed. */
export const ALLOWANCE_CORNER_KINDS = ['mitre', 'square', 'folded_prev', 'folded_next'] as const;
export const allowanceCornerSchema = z.enum(ALLOWANCE_CORNER_KINDS);

export const seamAllowanceSchema = z.object({
	defaultWidthMm: finite(),
	widthsMm: z.record(z.string(), finite()).default({}),
	corners: z.record(z.string(), allowanceCornerSchema).default({}),
	defaultCorner: allowanceCornerSchema.default('mitre'),
	cutLine: outlineSchema
});

export const pieceSchema = z.object({
	schemaVersion: z.literal(1),
	id: idSchema,
	name: z.string().min(1).max(120),
	outline: outlineSchema,
	apexes: readonlyArray(z.array(apexSchema)).default([]),
	darts: readonlyArray(z.array(dartSchema)).default([]),
	pleats: readonlyArray(z.array(pleatSchema)).default([]),
	notches: readonlyArray(z.array(notchSchema)).default([]),
	grainline: grainlineSchema.nullable().default(null),
	foldLine: lineMarkSchema.nullable().default(null),
	seamAllowance: seamAllowanceSchema.nullable().default(null),
	internalLines: readonlyArray(z.array(internalLineSchema)).default([]),
	drillHoles: readonlyArray(z.array(drillHoleSchema)).default([]),
	labels: readonlyArray(z.array(labelSchema)).default([]),
	cut: cutInstructionSchema,
	fabric: z.string().max(120).default('self')
});

export type VecData = z.infer<typeof vecSchema>;
export type ApexKind = z.infer<typeof apexKindSchema>;
export type Apex = z.infer<typeof apexSchema>;
export type LegSide = z.infer<typeof legSideSchema>;
export type Dart = z.infer<typeof dartSchema>;
export type PleatKind = z.infer<typeof pleatKindSchema>;
export type Pleat = z.infer<typeof pleatSchema>;
export type Notch = z.infer<typeof notchSchema>;
export type Grainline = z.infer<typeof grainlineSchema>;
export type LineMark = z.infer<typeof lineMarkSchema>;
export type InternalLine = z.infer<typeof internalLineSchema>;
export type DrillHole = z.infer<typeof drillHoleSchema>;
export type PieceLabel = z.infer<typeof labelSchema>;
export type CutInstruction = z.infer<typeof cutInstructionSchema>;
export type SeamAllowance = z.infer<typeof seamAllowanceSchema>;
/** A piece after parsing (defaults filled). */
export type Piece = z.infer<typeof pieceSchema>;
/** A piece as accepted by the parser (defaults optional). */
export type PieceInput = z.input<typeof pieceSchema>;
