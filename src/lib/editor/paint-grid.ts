import { PALETTE } from './palette';

/** The pattern paper's grid: a cross every 2 cm or every inch (the user's choice), a dot between. */
export type PaperGrid = '2cm' | '1in';

export const PAPER_GRID_MM: Record<PaperGrid, number> = { '2cm': 20, '1in': 25.4 };
export const PAPER_GRID_KEY = 'dartelier.paperGrid';

/** Crosses at the grid's corners, dots halfway between them, only over the visible part of the table. */
export function paintGrid(ctx: CanvasRenderingContext2D, grid: PaperGrid, scale: number, panX: number, panY: number, w: number, h: number): void {
	const x0 = -panX / scale;
	const y0 = -panY / scale;
	const x1 = (w - panX) / scale;
	const y1 = (h - panY) / scale;
	const px = 1 / scale;
	let step = PAPER_GRID_MM[grid];
	// far out, every other (then every fourth …) cross: never closer than 14 px on screen
	while (step * scale < 14) step *= 2;
	ctx.save();
	ctx.fillStyle = PALETTE.paper;
	ctx.fillRect(x0, y0, x1 - x0, y1 - y0);
	const arm = 3 * px;
	ctx.beginPath();
	for (let x = Math.ceil(x0 / step) * step; x <= x1; x += step) {
		for (let y = Math.ceil(y0 / step) * step; y <= y1; y += step) {
			ctx.moveTo(x - arm, y);
			ctx.lineTo(x + arm, y);
			ctx.moveTo(x, y - arm);
			ctx.lineTo(x, y + arm);
		}
	}
	ctx.strokeStyle = PALETTE.gridMajor;
	ctx.lineWidth = px;
	ctx.stroke();
	const half = step / 2;
	if (half * scale >= 10) {
		const r = 0.9 * px;
		ctx.beginPath();
		for (let x = Math.ceil(x0 / half) * half; x <= x1; x += half) {
			for (let y = Math.ceil(y0 / half) * half; y <= y1; y += half) {
				const onCross = Math.abs(x / step - Math.round(x / step)) < 1e-6 && Math.abs(y / step - Math.round(y / step)) < 1e-6;
				if (onCross) continue;
				ctx.moveTo(x + r, y);
				ctx.arc(x, y, r, 0, 2 * Math.PI);
			}
		}
		ctx.fillStyle = PALETTE.gridMajor;
		ctx.fill();
	}
	ctx.restore();
}
