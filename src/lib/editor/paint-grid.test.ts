import { describe, expect, it } from 'vitest';
import { paintGrid } from './paint-grid';

/** The pattern paper: crosses at the grid's corners (2 cm or 1 in), a dot halfway between. */
function recorded(grid: '2cm' | '1in', scale: number, sizePx: number) {
	const crosses: { x: number; y: number }[] = [];
	let dots = 0;
	const ctx = {
		save() {},
		restore() {},
		fillRect() {},
		beginPath() {},
		stroke() {},
		fill() {},
		lineTo() {},
		moveTo(x: number, y: number) {
			void x;
			void y;
		},
		arc() {
			dots++;
		}
	} as unknown as CanvasRenderingContext2D;
	// a cross is drawn as two strokes; its centre is the midpoint of the first one
	let start: { x: number; y: number } | null = null;
	let n = 0;
	ctx.moveTo = (x: number, y: number) => {
		start = { x, y };
	};
	ctx.lineTo = (x: number, y: number) => {
		if (start && n++ % 2 === 0) crosses.push({ x: (start.x + x) / 2, y: (start.y + y) / 2 });
	};
	paintGrid(ctx, grid, scale, 0, 0, sizePx, sizePx);
	return { crosses, dots };
}

describe('the pattern paper', () => {
	it('puts a cross every 2 cm and dots halfway between', () => {
		const r = recorded('2cm', 2, 200); // 100 mm square on screen
		expect(r.crosses.map((c) => c.x).filter((x, i, a) => a.indexOf(x) === i)).toEqual([0, 20, 40, 60, 80, 100]);
		expect(r.crosses).toHaveLength(36);
		expect(r.dots).toBe(11 * 11 - 36);
	});
	it('puts a cross every inch when inches are chosen', () => {
		const r = recorded('1in', 2, 200);
		const xs = [...new Set(r.crosses.map((c) => Math.round(c.x * 1000) / 1000))];
		expect(xs).toEqual([0, 25.4, 50.8, 76.2]);
	});
	it('thins the crosses out when zoomed far out (never closer than 14 px), and leaves the dots out when they would crowd', () => {
		const r = recorded('2cm', 0.2, 200);
		const xs = [...new Set(r.crosses.map((c) => c.x))].sort((a, b) => a - b);
		expect((xs[1] - xs[0]) * 0.2).toBeGreaterThanOrEqual(14);
		expect(r.dots).toBe(0);
	});
});
