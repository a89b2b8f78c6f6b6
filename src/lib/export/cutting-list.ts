import { outlineArea } from '$lib/pattern/kernel';
import { outlinePleatsAcross } from '$lib/pattern/export/pleat-marks';
import type { Piece } from '$lib/pattern/piece-schema';
import { cutInstructionLabel } from './piece-drawing';

/**
 * The cutting list of a style: per piece its fabric, cut instruction, quantity, grain and areas; per
 * fabric the total area to cut and the count of pieces. Areas are of the cloth one cut piece takes: a
 * piece cut on the fold is twice its pattern (the pattern is half the piece). "Net" is inside the
 * stitching line (dart wedges left out, pleat cloth kept), "cut" inside the cut line (with the seam
 * allowance; the same as net when the piece has none). Pure; mm².
 */
export interface CuttingListInput {
	readonly pieceId: string;
	readonly piece: Piece;
	readonly fabric: string;
	readonly versionNumber: number;
	readonly versionState: string;
}

export interface CuttingListRow {
	readonly pieceId: string;
	readonly name: string;
	readonly fabric: string;
	readonly cut: Piece['cut'];
	readonly cutInstruction: string;
	/** Pieces to cut from the cloth. */
	readonly quantity: number;
	readonly grain: string;
	readonly areaNetMm2: number;
	readonly areaCutMm2: number;
	/** quantity × cut area. */
	readonly totalCutAreaMm2: number;
	readonly versionNumber: number;
	readonly versionState: string;
}

export interface FabricTotal {
	readonly fabric: string;
	readonly pieceCount: number;
	readonly totalCutAreaMm2: number;
}

export interface CuttingList {
	readonly rows: readonly CuttingListRow[];
	readonly fabrics: readonly FabricTotal[];
}

export function cutQuantity(cut: Piece['cut']): number {
	return cut === 'pair' ? 2 : 1;
}

/** The grainline as a cutter reads it: its angle from the pattern's vertical, in whole degrees. */
export function grainText(piece: Piece): string {
	const g = piece.grainline;
	if (!g) return piece.cut === 'on_fold' ? 'along the fold' : 'not marked';
	let deg = (Math.atan2(g.to.x - g.from.x, g.to.y - g.from.y) * 180) / Math.PI;
	deg = Math.abs(((deg + 90) % 180 + 180) % 180 - 90);
	const rounded = Math.round(deg);
	if (rounded === 0) return 'straight grain (lengthwise)';
	if (rounded === 90) return 'crosswise grain';
	if (rounded === 45) return 'bias (45°)';
	return `${rounded}° off the lengthwise grain`;
}

export function cuttingList(inputs: readonly CuttingListInput[]): CuttingList {
	const rows = inputs.map((x): CuttingListRow => {
		const fold = x.piece.cut === 'on_fold' ? 2 : 1;
		const net = outlineArea(outlinePleatsAcross(x.piece)) * fold;
		const cut = (x.piece.seamAllowance ? outlineArea(x.piece.seamAllowance.cutLine) : net / fold) * fold;
		const quantity = cutQuantity(x.piece.cut);
		return {
			pieceId: x.pieceId,
			name: x.piece.name,
			fabric: x.fabric,
			cut: x.piece.cut,
			cutInstruction: cutInstructionLabel(x.piece.cut),
			quantity,
			grain: grainText(x.piece),
			areaNetMm2: net,
			areaCutMm2: cut,
			totalCutAreaMm2: cut * quantity,
			versionNumber: x.versionNumber,
			versionState: x.versionState
		};
	});
	const byFabric = new Map<string, { pieceCount: number; totalCutAreaMm2: number }>();
	for (const r of rows) {
		const t = byFabric.get(r.fabric) ?? { pieceCount: 0, totalCutAreaMm2: 0 };
		byFabric.set(r.fabric, { pieceCount: t.pieceCount + r.quantity, totalCutAreaMm2: t.totalCutAreaMm2 + r.totalCutAreaMm2 });
	}
	const fabrics = [...byFabric].map(([fabric, t]) => ({ fabric, ...t })).sort((a, b) => a.fabric.localeCompare(b.fabric));
	return { rows, fabrics };
}

/** One CSV cell: quoted when needed; a leading = + - @ is escaped so a spreadsheet never runs it. */
function csvCell(v: string | number): string {
	let s = typeof v === 'number' ? String(v) : v;
	if (typeof v === 'string' && /^[=+\-@\t\r]/.test(s)) s = `'${s}`;
	return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

const cm2 = (mm2: number) => Math.round(mm2) / 100;

/** The list as CSV (areas in cm², two decimals): the piece rows, then one total row per fabric. */
export function cuttingListCsv(list: CuttingList): string {
	const header = ['row', 'piece', 'fabric', 'cut', 'quantity', 'grain', 'area_net_cm2', 'area_cut_cm2', 'total_cut_cm2', 'version', 'state'];
	const lines = [header.join(',')];
	for (const r of list.rows) {
		lines.push(['piece', r.name, r.fabric, r.cutInstruction, r.quantity, r.grain, cm2(r.areaNetMm2), cm2(r.areaCutMm2), cm2(r.totalCutAreaMm2), r.versionNumber, r.versionState].map(csvCell).join(','));
	}
	for (const f of list.fabrics) {
		lines.push(['fabric_total', '', f.fabric, '', f.pieceCount, '', '', '', cm2(f.totalCutAreaMm2), '', ''].map(csvCell).join(','));
	}
	return lines.join('\r\n') + '\r\n';
}
