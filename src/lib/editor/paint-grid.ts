import { GRID_MM } from './hit';
import { PALETTE } from './palette';

/** The 10 mm grid (with 50 mm and 100 mm lines stronger), only over the visible part of the table. */
export function paintGrid(ctx: CanvasRenderingContext2D, scale: number, panX: number, panY: number, w: number, h: number): void {
	const x0 = -panX / scale;
	const y0 = -panY / scale;
	const x1 = (w - panX) / scale;
	const y1 = (h - panY) / scale;
	const px = 1 / scale;
	let step = GRID_MM;
	while (step * scale < 6) step *= step === GRID_MM ? 5 : 2;
	const lines = (every: number, colour: string, width: number) => {
		ctx.beginPath();
		for (let x = Math.ceil(x0 / every) * every; x <= x1; x += every) {
			ctx.moveTo(x, y0);
			ctx.lineTo(x, y1);
		}
		for (let y = Math.ceil(y0 / every) * every; y <= y1; y += every) {
			ctx.moveTo(x0, y);
			ctx.lineTo(x1, y);
		}
		ctx.strokeStyle = colour;
		ctx.lineWidth = width * px;
		ctx.stroke();
	};
	ctx.save();
	ctx.fillStyle = PALETTE.paper;
	ctx.fillRect(x0, y0, x1 - x0, y1 - y0);
	lines(step, PALETTE.chalk, 1);
	if (step * 10 * scale > 40) lines(step * 10, PALETTE.gridMajor, 1);
	ctx.restore();
}
