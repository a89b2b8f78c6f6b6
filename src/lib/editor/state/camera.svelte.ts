import type { BoundingBox, Vec } from '$lib/geometry';
import { PAPER_GRID_KEY, type PaperGrid } from '../paint-grid';
import type { LengthUnit } from '$lib/pattern/measurements/units';
import { CALIBRATION_KEY, DEFAULT_PX_PER_MM, fitBox, MAX_TRUE_FACTOR, screenToWorld, UNIT_KEY, worldToScreen, zoomAbout, type View } from '../view';

/** Where the remembered settings of this browser live (localStorage in the page, nothing in tests). */
export interface SettingsStore {
	getItem(key: string): string | null;
	setItem(key: string, value: string): void;
}

const NO_BOX: BoundingBox = { minX: 0, minY: 0, maxX: 500, maxY: 500 };

/**
 * The camera over the table: zoom and pan (screen px = world mm × scale + pan), the size of the view,
 * the true-scale calibration of this screen (px per mm at 1:1) and the unit lengths are shown in.
 * `content` gives the box of everything on the table, for fitting.
 */
export class Camera {
	scale = $state(DEFAULT_PX_PER_MM);
	panX = $state(0);
	panY = $state(0);
	viewW = $state(800);
	viewH = $state(600);
	calibration = $state(DEFAULT_PX_PER_MM);
	unit = $state<LengthUnit>('mm');
	/** The pattern paper: a cross every 2 cm or every inch. */
	paperGrid = $state<PaperGrid>('2cm');

	private readonly content: () => BoundingBox;
	private readonly settings: SettingsStore | null;

	constructor(content: () => BoundingBox, settings: SettingsStore | null) {
		this.content = content;
		this.settings = settings;
		if (settings) {
			const c = Number(settings.getItem(CALIBRATION_KEY));
			if (Number.isFinite(c) && c > 0.5 && c < 50) this.calibration = c;
			const u = settings.getItem(UNIT_KEY);
			if (u === 'mm' || u === 'cm' || u === 'in') this.unit = u;
			const g = settings.getItem(PAPER_GRID_KEY);
			this.paperGrid = g === '1in' || g === '2cm' ? g : this.unit === 'in' ? '1in' : '2cm';
		}
		this.scale = this.calibration;
	}

	zoomPercent = $derived(Math.round((this.scale / this.calibration) * 100));
	minScale = $derived(Math.min(this.fitView().scale, this.calibration) * 0.5);
	maxScale = $derived(this.calibration * MAX_TRUE_FACTOR);

	view(): View {
		return { scale: this.scale, panX: this.panX, panY: this.panY };
	}
	toWorld(screen: Vec): Vec {
		return screenToWorld(this.view(), screen);
	}
	toScreen(world: Vec): Vec {
		return worldToScreen(this.view(), world);
	}
	private setView(v: View) {
		this.scale = v.scale;
		this.panX = v.panX;
		this.panY = v.panY;
	}
	fitView(): View {
		const box = this.content();
		return fitBox(Number.isFinite(box.minX) ? box : NO_BOX, this.viewW, this.viewH);
	}
	fit() {
		this.setView(this.fitView());
	}
	private centre(): Vec {
		return { x: this.viewW / 2, y: this.viewH / 2 };
	}
	zoomBy(factor: number, at: Vec = this.centre()) {
		this.setView(zoomAbout(this.view(), factor, at, this.minScale, this.maxScale));
	}
	/** 1:1 on screen, as calibrated. */
	trueSize(at: Vec = this.centre()) {
		this.zoomBy(this.calibration / this.scale, at);
	}
	panBy(dx: number, dy: number) {
		this.panX += dx;
		this.panY += dy;
	}
	/** The view's size changed; the first real size fits the style in it. */
	resize(width: number, height: number) {
		const first = this.viewW === 800 && this.viewH === 600;
		this.viewW = Math.max(100, width);
		this.viewH = Math.max(100, height);
		if (first) this.fit();
	}
	/** A ruler said how long 100 mm is on this screen: 1:1 follows, the zoom factor stays. */
	setCalibration(pxPerMm: number): boolean {
		if (!(pxPerMm > 0.5 && pxPerMm < 50)) return false;
		const factor = this.scale / this.calibration;
		this.calibration = pxPerMm;
		this.settings?.setItem(CALIBRATION_KEY, String(pxPerMm));
		this.zoomBy((pxPerMm * factor) / this.scale);
		return true;
	}
	setUnit(u: LengthUnit) {
		this.unit = u;
		this.settings?.setItem(UNIT_KEY, u);
	}
	setPaperGrid(g: PaperGrid) {
		this.paperGrid = g;
		this.settings?.setItem(PAPER_GRID_KEY, g);
	}
	/** Pointer tolerance in mm (a few screen pixels). */
	tolMm(px = 8): number {
		return px / this.scale;
	}
}
