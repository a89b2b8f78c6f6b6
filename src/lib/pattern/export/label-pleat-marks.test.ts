import { describe, expect, it } from 'vitest';
import { outlineContainsPoint, outlineFlatten, vecDistance, type Vec } from '../kernel';
import { frontBodiceBlock } from '../fixtures/front-bodice-block';
import { demoPath } from '../fixtures/demo-path';
import type { Piece } from '../piece-schema';
import { LABEL_CLEARANCE_MM, labelPlacement, pieceMarkPolylines } from './label-place';
import { outlinePleatsAcross, PLEAT_MARK_LENGTH_MM, pleatMarks } from './pleat-marks';
import { pieceSvg } from './svg';

const meta = { styleName: 'Juniper corset bodice', styleCode: 'LR-214', sizeLabel: 'ASTM D5585 curvy 10', versionNumber: 4 };
const lines = ['Juniper corset bodice · LR-214', 'Upper front', 'ASTM D5585 curvy 10', 'cut 2 (mirror)', 'seam allowance included (15 mm unless marked)', 'version 4'];

/** Points every 0.5 mm along a polyline (a one-point polyline is that point). */
function samples(line: readonly Vec[]): Vec[] {
	if (line.length === 1) return [line[0]];
	const out: Vec[] = [];
	for (let i = 0; i + 1 < line.length; i++) {
		const steps = Math.max(1, Math.ceil(vecDistance(line[i], line[i + 1]) / 0.5));
		for (let k = 0; k <= steps; k++) out.push({ x: line[i].x + ((line[i + 1].x - line[i].x) * k) / steps, y: line[i].y + ((line[i + 1].y - line[i].y) * k) / steps });
	}
	return out;
}

function expectLabelClear(piece: Piece) {
	const l = labelPlacement(piece, lines);
	expect(l.inside, `${piece.name}: label inside the piece`).toBe(true);
	const b = l.box;
	const outline = outlinePleatsAcross(piece);
	for (let x = b.minX; x <= b.maxX + 1e-9; x += (b.maxX - b.minX) / 10) {
		for (let y = b.minY; y <= b.maxY + 1e-9; y += (b.maxY - b.minY) / 10) {
			expect(outlineContainsPoint(outline, { x, y }), `${piece.name}: label point (${x.toFixed(1)}, ${y.toFixed(1)}) inside`).toBe(true);
		}
	}
	// no mark and no stretch of the stitching line comes nearer the text block than the clearance
	const stitch = outlineFlatten(outline, 0.1);
	const near = (p: Vec) => p.x > b.minX - LABEL_CLEARANCE_MM + 0.01 && p.x < b.maxX + LABEL_CLEARANCE_MM - 0.01 && p.y > b.minY - LABEL_CLEARANCE_MM + 0.01 && p.y < b.maxY + LABEL_CLEARANCE_MM - 0.01;
	for (const m of [...pieceMarkPolylines(piece), [...stitch, stitch[0]]]) {
		const hit = samples(m).find(near);
		expect(hit, `${piece.name}: a mark at (${hit?.x.toFixed(1)}, ${hit?.y.toFixed(1)}) is too near the label`).toBeUndefined();
	}
	return l;
}

describe('SVG export: labels clear of marks', () => {
	it('places the label of the front block inside the piece, clear of the grainline and every other mark', () => {
		const piece = frontBodiceBlock();
		const l = expectLabelClear(piece);
		// the grainline runs at x = 40 from y = 150 to 400: the block does not sit across it
		const g = piece.grainline!;
		expect(l.box.minX > g.from.x + LABEL_CLEARANCE_MM || l.box.maxX < g.from.x - LABEL_CLEARANCE_MM || l.box.maxY < g.from.y || l.box.minY > g.to.y).toBe(true);
		// and the SVG prints its own lines where the placement for them says
		const svg = pieceSvg(piece, meta);
		const group = /<g id="labels"([^>]*)>(.*?)<\/g>/.exec(svg)!;
		const printed = [...group[2].matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1].replace(/&amp;/g, '&'));
		expect(printed).toContain(piece.name);
		const placed = labelPlacement(piece, printed);
		const at = placed.turned ? /translate\(([-\d.]+) ([-\d.]+)\) rotate\(-90\)/.exec(group[1])! : /<text x="([-\d.]+)" y="([-\d.]+)"/.exec(group[2])!;
		expect(Number(at[1])).toBeCloseTo(placed.at.x, 4);
		expect(Number(at[2])).toBeGreaterThanOrEqual(placed.at.y - 1e-4);
	});

	it('places the label clear of the marks on every piece of the demo style, narrow panels and pleated upper front included', () => {
		for (const p of demoPath().pieces) {
			expectLabelClear(p.first.geometry);
			for (const v of p.later) expectLabelClear(v.geometry);
		}
	});
});

describe('SVG export: pleats as a cutter marks them', () => {
	const upper = demoPath().pieces.find((p) => p.key === 'upper-front')!;
	const pleated = upper.later.find((v) => v.geometry.pleats.length === 2)!.geometry;
	const bp = pleated.apexes.find((a) => a.id === pleated.pleats[0].apexId)!.point;

	it('draws each pleat as fold line, placement line and fold arrow from the seam over the marked length, not down to the bust point', () => {
		const svg = pieceSvg(pleated, meta);
		const groups = [...svg.matchAll(/<g class="pleat" data-pleat="([^"]+)">(.*?)<\/g>/g)];
		expect(groups).toHaveLength(2);
		for (const [, id, body] of groups) {
			const p = pleated.pleats.find((q) => q.id === id)!;
			const coords = (cls: string) => {
				const m = new RegExp(`<line x1="([-\\d.]+)" y1="([-\\d.]+)" x2="([-\\d.]+)" y2="([-\\d.]+)" class="${cls}"`).exec(body)!;
				return [{ x: Number(m[1]), y: Number(m[2]) }, { x: Number(m[3]), y: Number(m[4]) }];
			};
			for (const [cls, from] of [['fold', p.foldLine.from], ['placement', p.placementLine.from]] as const) {
				const [a, b] = coords(cls);
				expect(vecDistance(a, from)).toBeLessThan(1e-5); // starts on the seam
				expect(vecDistance(a, b)).toBeCloseTo(PLEAT_MARK_LENGTH_MM, 4);
				expect(vecDistance(b, bp)).toBeGreaterThan(vecDistance(from, bp) - PLEAT_MARK_LENGTH_MM - 1e-6);
			}
			const [af, at] = coords('fold-arrow');
			expect(vecDistance(af, bp)).toBeGreaterThan(vecDistance(p.foldLine.from, bp) - PLEAT_MARK_LENGTH_MM);
			expect(vecDistance(at, af)).toBeGreaterThan(0);
		}
		// the stitching line runs across the pleats' mouths: it no longer visits the bust point
		const d = /<g id="stitching-line"[^>]*><path d="([^"]+)"/.exec(svg)![1];
		const pts = [...d.matchAll(/([-\d.]+) ([-\d.]+)/g)].map((m) => ({ x: Number(m[1]), y: Number(m[2]) }));
		expect(pts.every((q) => vecDistance(q, bp) > 1)).toBe(true);
	});

	it("marks a tuck over its stitched length", () => {
		const tucked = { ...pleated, pleats: pleated.pleats.map((p) => ({ ...p, kind: 'tuck' as const, stitchLengthMm: 40 })) };
		for (const p of tucked.pleats) {
			const m = pleatMarks(p);
			expect(vecDistance(m.fold[0], m.fold[1])).toBeCloseTo(40, 6);
			expect(vecDistance(m.placement[0], m.placement[1])).toBeCloseTo(40, 6);
		}
	});
});
