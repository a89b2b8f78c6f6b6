import { pathBoundingBox, boundingBoxUnion, BOUNDING_BOX_EMPTY, vecAdd, type Vec } from '$lib/geometry';
import { ledgerBalance, type LedgerEntry } from '$lib/pattern/ledger';
import { pieceMetrics } from '$lib/pattern/metrics';
import type { CutInstruction, Piece } from '$lib/pattern/piece-schema';
import { recipeStepApply } from '$lib/pattern/recipe/registry';
import { versionVerify, type RecipeStepData } from '$lib/pattern/verify/version-verify';
import type { AllowanceCorner, SeamPair } from '$lib/pattern/panels';
import { ApiFailure, changeSave, pieceLoad, seamPairPatch, styleLoad, versionSave, type SaveResult, type SeamPairInfo } from './api';
import { changeBodyBuild, changeNewPieces, changeSourceNames, namingProblem, pieceRenamed, type PendingStep } from './change-save';
import { docReplacePiece, pieceIsDirty, type EditorDoc, type HistoryEntry, type PendingSeam, type PieceEdit, type SeamEdit, type StepRecord } from './doc';
import { pieceDrawing } from './drawing';
import { hitTest, snapPoint, type Hit, type PlacedPiece, type Snap, type SnapOptions } from './hit';
import { editorApply, editorSeparate } from './ops';
import { TOOLS } from './tools/registry';
import type { ToolId, ToolPreview } from './tools/types';
import type { LengthUnit } from './units';
import { CALIBRATION_KEY, DEFAULT_PX_PER_MM, fitBox, MAX_TRUE_FACTOR, screenToWorld, UNIT_KEY, worldToScreen, zoomAbout } from './view';

/** Parameters the tools collect (one object: tools are pure functions over this state). */
export interface ToolInput {
	pieceKey: string | null;
	dartId: string | null;
	lineId: string | null;
	target: Vec | null;
	points: Vec[];
	fractions: number[];
	keepFraction: number;
	count: number;
	firstAtMm: number;
	spacingMm: number;
	mode: 'equal_angle' | 'equal_intake';
	kind: 'pleat' | 'tuck';
	foldToward: 'auto' | 'leg1' | 'leg2';
	parallelMm: number;
	clearanceMm: number;
	pressToward: 'leg1' | 'leg2';
	/** Style line: start, handle 1, handle 2, end (piece coordinates). */
	handles: Vec[];
	dragIndex: number;
	dragging: boolean;
	/** Join / carry / true seam: the picked pieces, a stored seam pair, or edges picked by clicking. */
	keys: string[];
	seamPairId: string | null;
	edgePicks: { pieceKey: string; at: Vec }[];
	wedge: 'close' | 'keep_as_dart';
	fuse: 'above' | 'below';
	residualAs: 'dart' | 'pleats';
	adjust: 'none' | 'a-start' | 'a-end' | 'b-start' | 'b-end';
	/** Allowance: corners given their own shape (corner index → shape). */
	allowanceCorners: Record<number, AllowanceCorner>;
}

function freshInput(): ToolInput {
	return {
		pieceKey: null,
		dartId: null,
		lineId: null,
		target: null,
		points: [],
		fractions: [],
		keepFraction: 0,
		count: 2,
		firstAtMm: 15,
		spacingMm: 30,
		mode: 'equal_angle',
		kind: 'pleat',
		foldToward: 'auto',
		parallelMm: 0,
		clearanceMm: 20,
		pressToward: 'leg1',
		handles: [],
		dragIndex: -1,
		dragging: false,
		keys: [],
		seamPairId: null,
		edgePicks: [],
		wedge: 'close',
		fuse: 'below',
		residualAs: 'dart',
		adjust: 'none',
		allowanceCorners: {}
	};
}

export interface Selection {
	pieceKey: string | null;
	segmentIndex: number;
	point: Vec | null;
}

export interface SaveReport {
	readonly pieceKey: string;
	readonly name: string;
	readonly number: number;
	readonly message: string;
	readonly checks: SaveResult['checks'];
	readonly warnings: SaveResult['warnings'];
}

export interface Conflict {
	readonly pieceKey: string;
	readonly name: string;
	readonly message: string;
	readonly headId: string;
	readonly headNumber: number;
	readonly head: Piece | null;
	readonly headMessage: string;
	readonly headAuthor: string;
	readonly saveMessage: string;
}

const GAP_MM = 60;
/** Seam pairs made by Separate and Carry: sewn to match (no ease), trued to 1/16 in. */
const NEW_SEAM_TOLERANCE_MM = 1.6;

/** A panel operation's seam pairs (pieces named by geometry id) as pending pairs between the new pieces' editor keys. */
function pendingSeams(pairs: readonly SeamPair[], made: readonly PieceEdit[], label: (i: number, a: PieceEdit, b: PieceEdit) => string): PendingSeam[] {
	const byId = new Map(made.map((p) => [p.geometry.id, p]));
	return pairs.flatMap((sp, i) => {
		const a = byId.get(sp.a.pieceId);
		const b = byId.get(sp.b.pieceId);
		if (!a || !b || a === b) return [];
		return [{ label: label(i, a, b).slice(0, 120), a: { pieceKey: a.key, edge: sp.a.edge }, b: { pieceKey: b.key, edge: sp.b.edge }, allowedEaseMm: 0, toleranceMm: NEW_SEAM_TOLERANCE_MM }];
	});
}

export class EditorState {
	readonly studioId: string;
	readonly styleId: string;
	readonly canEdit: boolean;

	styleName = $state('');
	loading = $state(true);
	loadError = $state<string | null>(null);
	seamPairs = $state.raw<readonly SeamPairInfo[]>([]);

	doc = $state.raw<EditorDoc>({ pieces: [] });
	past = $state.raw<readonly HistoryEntry[]>([]);
	future = $state.raw<readonly HistoryEntry[]>([]);

	selection = $state<Selection>({ pieceKey: null, segmentIndex: -1, point: null });
	hover = $state.raw<Hit | null>(null);
	snapShown = $state.raw<Snap | null>(null);
	/** A piece being moved on the canvas and where it would go (world offset). */
	moving = $state.raw<{ key: string; offset: Vec } | null>(null);

	tool = $state<ToolId>('select');
	input = $state<ToolInput>(freshInput());
	toolMessage = $state<string | null>(null);

	scale = $state(DEFAULT_PX_PER_MM);
	panX = $state(0);
	panY = $state(0);
	viewW = $state(800);
	viewH = $state(600);
	calibration = $state(DEFAULT_PX_PER_MM);
	unit = $state<LengthUnit>('mm');
	showCut = $state(true);
	helpOpen = $state(false);
	calibrateOpen = $state(false);

	saving = $state<{ done: number; total: number; name: string } | null>(null);
	saveError = $state<string | null>(null);
	saveReports = $state.raw<readonly SaveReport[]>([]);
	conflict = $state.raw<Conflict | null>(null);
	announce = $state('');
	/** New pieces of a multi-piece change to name before it is saved (the dialog shows while set). */
	naming = $state<{ key: string; name: string; cut: CutInstruction }[] | null>(null);
	namingError = $state<string | null>(null);
	private namingDone = false;
	private namingMessage = '';

	constructor(studioId: string, styleId: string, canEdit: boolean) {
		this.studioId = studioId;
		this.styleId = styleId;
		this.canEdit = canEdit;
		if (typeof localStorage !== 'undefined') {
			const c = Number(localStorage.getItem(CALIBRATION_KEY));
			if (Number.isFinite(c) && c > 0.5 && c < 50) this.calibration = c;
			const u = localStorage.getItem(UNIT_KEY);
			if (u === 'mm' || u === 'cm' || u === 'in') this.unit = u;
		}
		this.scale = this.calibration;
	}

	// ---------- derived ----------
	visible = $derived(this.doc.pieces.filter((p) => !p.retired));
	placed = $derived<PlacedPiece[]>(this.visible.map((p) => ({ key: p.key, piece: p.geometry, offset: p.offset })));
	selected = $derived(this.doc.pieces.find((p) => p.key === this.selection.pieceKey && !p.retired) ?? null);
	preview = $derived.by<ToolPreview | null>(() => TOOLS[this.tool].preview?.(this) ?? null);
	dirty = $derived(this.doc.pieces.filter(pieceIsDirty));
	zoomPercent = $derived(Math.round((this.scale / this.calibration) * 100));
	minScale = $derived(Math.min(this.fitView().scale, this.calibration) * 0.5);
	maxScale = $derived(this.calibration * MAX_TRUE_FACTOR);

	/** Metrics of the selected piece (the preview's result while a tool previews on it). */
	selectedMetrics = $derived.by(() => {
		const p = this.selected;
		if (!p) return null;
		const pv = this.preview;
		const piece = pv?.piece && pv.pieceKey === p.key ? pv.piece : p.geometry;
		return pieceMetrics(piece);
	});

	/** Ledger entries since the base version (with the preview's, if it previews on the selected piece). */
	selectedLedger = $derived.by<LedgerEntry[]>(() => {
		const p = this.selected;
		if (!p) return [];
		const entries = p.steps.flatMap((s) => s.ledger);
		const pv = this.preview;
		if (pv?.piece && pv.pieceKey === p.key) entries.push(...pv.ledger);
		return entries;
	});
	selectedBalance = $derived(ledgerBalance(this.selectedLedger));

	/** The checks the server will run on save (versionVerify in the browser). */
	selectedVerify = $derived.by(() => {
		const p = this.selected;
		if (!p || p.steps.length === 0 || !p.base) return null;
		return versionVerify(p.base, p.geometry, this.recipeOf(p), recipeStepApply, this.declaredOf(p));
	});

	// ---------- loading ----------
	async load(): Promise<void> {
		this.loading = true;
		this.loadError = null;
		try {
			const d = await styleLoad(this.studioId, this.styleId);
			this.styleName = d.style.name;
			this.seamPairs = d.seamPairs;
			let x = 0;
			let y = 0;
			let rowHeight = 0;
			const pieces: PieceEdit[] = [];
			const shown = d.pieces.filter((p) => p.shown);
			const perRow = Math.max(1, Math.ceil(Math.sqrt(shown.length * 1.6)));
			for (const [i, sp] of shown.entries()) {
				if (!sp.shown) continue;
				if (i > 0 && i % perRow === 0) {
					x = 0;
					y += rowHeight + GAP_MM;
					rowHeight = 0;
				}
				const g = sp.shown.geometry;
				const box = pieceDrawing(g).outerBox;
				const offset = { x: x - box.minX, y: y - box.minY };
				x += box.maxX - box.minX + GAP_MM;
				rowHeight = Math.max(rowHeight, box.maxY - box.minY);
				pieces.push({
					key: sp.id,
					name: sp.name,
					cut: sp.cut,
					fabric: sp.fabric,
					baseVersionId: sp.shown.id,
					baseNumber: sp.shown.number,
					base: g,
					geometry: g,
					steps: [],
					offset,
					origin: null,
					retired: false,
					readOnly: !this.canEdit || sp.shown.id !== sp.headVersionId
				});
			}
			this.doc = { pieces };
			this.past = [];
			this.future = [];
			if (pieces.length && !this.selection.pieceKey) this.selection.pieceKey = pieces[0].key;
			this.fit();
		} catch (e) {
			this.loadError = e instanceof Error ? e.message : 'The style could not be loaded.';
		} finally {
			this.loading = false;
		}
	}

	// ---------- view ----------
	view() {
		return { scale: this.scale, panX: this.panX, panY: this.panY };
	}
	toWorld(screen: Vec): Vec {
		return screenToWorld(this.view(), screen);
	}
	toScreen(world: Vec): Vec {
		return worldToScreen(this.view(), world);
	}
	private setView(v: { scale: number; panX: number; panY: number }) {
		this.scale = v.scale;
		this.panX = v.panX;
		this.panY = v.panY;
	}
	fitView() {
		let box = BOUNDING_BOX_EMPTY;
		for (const p of this.visible) {
			const b = pieceDrawing(p.geometry).outerBox;
			box = boundingBoxUnion(box, { minX: b.minX + p.offset.x, minY: b.minY + p.offset.y, maxX: b.maxX + p.offset.x, maxY: b.maxY + p.offset.y });
		}
		if (!Number.isFinite(box.minX)) box = { minX: 0, minY: 0, maxX: 500, maxY: 500 };
		return fitBox(box, this.viewW, this.viewH);
	}
	fit() {
		this.setView(this.fitView());
	}
	zoomBy(factor: number, at: Vec = { x: this.viewW / 2, y: this.viewH / 2 }) {
		this.setView(zoomAbout(this.view(), factor, at, this.minScale, this.maxScale));
	}
	/** 1:1 on screen, as calibrated. */
	trueSize(at: Vec = { x: this.viewW / 2, y: this.viewH / 2 }) {
		this.zoomBy(this.calibration / this.scale, at);
	}
	panBy(dx: number, dy: number) {
		this.panX += dx;
		this.panY += dy;
	}
	setCalibration(pxPerMm: number) {
		if (!(pxPerMm > 0.5 && pxPerMm < 50)) return;
		const factor = this.scale / this.calibration;
		this.calibration = pxPerMm;
		localStorage.setItem(CALIBRATION_KEY, String(pxPerMm));
		this.zoomBy((pxPerMm * factor) / this.scale);
	}
	setUnit(u: LengthUnit) {
		this.unit = u;
		localStorage.setItem(UNIT_KEY, u);
	}
	/** Pointer tolerance in mm (a few screen pixels). */
	tolMm(px = 8): number {
		return px / this.scale;
	}

	// ---------- pieces ----------
	piece(key: string | null): PieceEdit | null {
		return key ? (this.doc.pieces.find((p) => p.key === key) ?? null) : null;
	}
	hitAt(world: Vec): Hit | null {
		return hitTest(this.placed, world, this.tolMm(7));
	}
	snapAt(world: Vec, opts: SnapOptions = {}): Snap {
		return snapPoint(this.placed, world, this.tolMm(9), { grid: true, ...opts });
	}
	/** Piece coordinates of a world point for a piece. */
	local(key: string, world: Vec): Vec {
		const p = this.piece(key);
		return p ? { x: world.x - p.offset.x, y: world.y - p.offset.y } : world;
	}
	recipeOf(p: PieceEdit): RecipeStepData[] {
		return p.steps.map((s) => ({ op: s.op, params: s.params }));
	}
	/** Labelled changes declared with the steps (e.g. a trued seam's length), sent with the save. */
	declaredOf(p: PieceEdit): LedgerEntry[] {
		return p.steps.flatMap((s) => s.declared ?? []);
	}

	// ---------- history ----------
	private push(next: EditorDoc, label: string) {
		this.namingDone = false;
		this.past = [...this.past, { doc: this.doc, label }];
		this.future = [];
		this.doc = next;
		this.announce = label;
	}
	undo() {
		const last = this.past.at(-1);
		if (!last) return;
		this.cancelTool();
		this.future = [{ doc: this.doc, label: last.label }, ...this.future];
		this.past = this.past.slice(0, -1);
		this.doc = last.doc;
		this.announce = `Undone: ${last.label}`;
		this.fixSelection();
	}
	redo() {
		const next = this.future[0];
		if (!next) return;
		this.cancelTool();
		this.past = [...this.past, { doc: this.doc, label: next.label }];
		this.future = this.future.slice(1);
		this.doc = next.doc;
		this.announce = `Redone: ${next.label}`;
		this.fixSelection();
	}
	private fixSelection() {
		if (!this.selected) this.selection.pieceKey = this.visible[0]?.key ?? null;
	}

	/** Apply one step to a piece; returns an error message or null. */
	apply(key: string, step: RecipeStepData, label?: string, declared: readonly LedgerEntry[] = [], seamEdit?: SeamEdit): string | null {
		const p = this.piece(key);
		if (!p || p.readOnly) return 'This piece cannot be changed here.';
		const r = editorApply(p.geometry, step);
		if (!r.ok) return r.error.message;
		const rec: StepRecord = { op: step.op, params: step.params, ledger: [...r.ledgerEntries, ...declared], summary: r.report.summary, notes: r.report.notes, declared, ...(seamEdit ? { seamEdit } : {}) };
		this.push(
			docReplacePiece(this.doc, key, (q) => ({ ...q, geometry: r.piece, steps: [...q.steps, rec] })),
			label ?? `${p.name}: ${r.report.summary}`
		);
		return null;
	}

	/** Cut a piece along one of its style lines into two new pieces (saved as new pieces). */
	separatePiece(key: string, styleLineId: string): string | null {
		const p = this.piece(key);
		if (!p || p.readOnly) return 'This piece cannot be changed here.';
		const names: [string, string] = [`${p.name} — upper`, `${p.name} — lower`];
		const r = editorSeparate(p.geometry, { styleLineId, pieceNames: names });
		if (!r.ok) return r.error.message;
		const stamp = Date.now().toString(36);
		const made: PieceEdit[] = r.pieces.map((g, i) => pieceEditNew(`new-${stamp}-${i}`, g, vecAdd(p.offset, { x: 0, y: i * 25 })));
		const step: PendingStep = { op: 'separate', params: { styleLineId, pieceNames: names }, sources: [{ key, recipe: this.recipeOf(p) }], resultKeys: made.map((m) => m.key) };
		const pieces = this.doc.pieces.flatMap((q) => (q.key === key ? [{ ...q, retired: true }, ...made] : [q]));
		const line = p.geometry.internalLines.find((l) => l.id === styleLineId);
		const seams = pendingSeams(r.seamPairs, made, () => `${p.name} separated at ${line?.label || 'the style line'}`);
		this.push({ pieces, pendingSteps: [...(this.doc.pendingSteps ?? []), step], pendingSeams: [...(this.doc.pendingSeams ?? []), ...seams] }, `${p.name}: separated into ${made.length} pieces — ${r.report.summary}`);
		this.selection.pieceKey = made[0]?.key ?? null;
		return null;
	}

	/**
	 * Panels merged into new pieces (join, carry): the step is kept to be saved as a style change (with
	 * the new pieces, recomputed by the server from the sources' versions); the sources are hidden here.
	 */
	mergePieces(
		sources: readonly string[],
		made: readonly Piece[],
		step: Pick<PendingStep, 'op' | 'params'>,
		label: string,
		seamPairs: readonly SeamPair[] = [],
		seamLabel: (i: number, a: PieceEdit, b: PieceEdit) => string = (i) => `seam ${i + 1}`
	): string | null {
		const src = sources.map((k) => this.piece(k));
		if (src.some((p) => !p || p.readOnly)) return 'These pieces cannot be changed here.';
		if (src.some((p) => p!.steps.length > 0)) return 'Save the changes to these pieces first: a merged piece starts from saved versions.';
		const first = src[0]!;
		const stamp = Date.now().toString(36);
		const list: PieceEdit[] = made.map((g, i) => pieceEditNew(`new-${stamp}-${i}`, g, first.offset));
		const pending: PendingStep = { ...step, sources: sources.map((key) => ({ key, recipe: [] })), resultKeys: list.map((p) => p.key) };
		const gone = new Set(sources);
		const pieces = [...this.doc.pieces.map((q) => (gone.has(q.key) ? { ...q, retired: true } : q)), ...list];
		this.push({ pieces, pendingSteps: [...(this.doc.pendingSteps ?? []), pending], pendingSeams: [...(this.doc.pendingSeams ?? []), ...pendingSeams(seamPairs, list, seamLabel)] }, label);
		this.selection.pieceKey = list[0]?.key ?? null;
		return null;
	}

	/** Lay pieces at their own (drafting) coordinates: one shared offset, no spreading. */
	layAsDrafted(keys: readonly string[]) {
		const first = this.piece(keys[0] ?? null);
		if (!first) return;
		const gone = new Set(keys);
		this.push({ ...this.doc, pieces: this.doc.pieces.map((q) => (gone.has(q.key) ? { ...q, offset: first.offset } : q)) }, `${keys.length} pieces laid as drafted`);
	}

	movePiece(key: string, offset: Vec) {
		const p = this.piece(key);
		if (!p) return;
		this.push(docReplacePiece(this.doc, key, (q) => ({ ...q, offset })), `${p.name} moved on the table`);
	}

	// ---------- tools ----------
	setTool(id: ToolId) {
		if (TOOLS[id].edits && !this.canEdit) return;
		this.tool = id;
		this.input = freshInput();
		if (id === 'grain') this.input.spacingMm = 200;
		if (id === 'allowance') this.input.clearanceMm = 10;
		if (id === 'notch') this.input.count = 1;
		const sel = this.selected;
		if (sel && !sel.readOnly) {
			this.input.pieceKey = sel.key;
			if (sel.geometry.darts.length) this.input.dartId = sel.geometry.darts[0].id;
			if (sel.geometry.internalLines.length) this.input.lineId = sel.geometry.internalLines[0].id;
		}
		TOOLS[id].start?.(this);
		this.toolMessage = null;
		this.announce = `${TOOLS[id].name} tool`;
	}
	cancelTool() {
		const keep = this.input.pieceKey;
		const { keys, seamPairId, wedge, fuse, residualAs, adjust } = this.input;
		this.input = freshInput();
		this.input.pieceKey = keep;
		Object.assign(this.input, { keys, seamPairId, wedge, fuse, residualAs, adjust });
		if (keep) {
			const g = this.piece(keep)?.geometry;
			if (g?.darts.length) this.input.dartId = g.darts[0].id;
			if (g?.internalLines.length) this.input.lineId = g.internalLines[0].id;
		}
		this.moving = null;
		this.toolMessage = null;
	}
	escape() {
		if (this.helpOpen) this.helpOpen = false;
		else if (this.calibrateOpen) this.calibrateOpen = false;
		else if (this.tool !== 'select' && (this.input.target || this.input.points.length || this.input.handles.length || this.input.edgePicks.length)) this.cancelTool();
		else if (this.tool !== 'select') this.setTool('select');
		else this.selection.segmentIndex = -1;
	}
	commitTool() {
		const def = TOOLS[this.tool];
		if (def.commit) def.commit(this);
	}
	/** Commit a previewed single-piece step; used by tools. */
	commitStep(step: RecipeStepData): boolean {
		const key = this.input.pieceKey;
		if (!key) return false;
		const err = this.apply(key, step);
		this.toolMessage = err;
		if (!err) {
			const keep = { ...this.input };
			this.cancelTool();
			this.input.mode = keep.mode;
			this.input.kind = keep.kind;
			this.input.count = keep.count;
			this.input.spacingMm = keep.spacingMm;
			this.input.firstAtMm = keep.firstAtMm;
			this.input.clearanceMm = keep.clearanceMm;
			// the next step starts with picking its dart again (no preview of a dart nobody chose)
			this.input.dartId = null;
		}
		return !err;
	}

	// ---------- saving ----------
	async save(message: string): Promise<void> {
		if (this.saving) return;
		const todo = this.dirty;
		if (!todo.length) {
			this.saveError = 'Nothing to save: no piece has changed since its version.';
			return;
		}
		if (!message.trim()) {
			this.saveError = 'Say what changed in a few words before saving.';
			return;
		}
		const news = changeNewPieces(this.doc);
		if (news.length && !this.namingDone) {
			// a new piece gets its own name and cut instruction, asked for on saving
			this.naming = news.map((p) => ({ key: p.key, name: p.name, cut: p.cut }));
			this.namingError = null;
			this.namingMessage = message;
			return;
		}
		this.saveError = null;
		this.conflict = null;
		const reports: SaveReport[] = [];
		const singles = todo.filter((p) => !p.origin);
		this.saving = { done: 0, total: singles.length + (news.length ? 1 : 0), name: news.length ? 'the new pieces' : todo[0].name };
		try {
			if (news.length) {
				const r = await this.saveChange(message);
				if (!r) return;
				reports.push(...r);
				this.saveReports = [...reports];
			}
			for (const [i, p] of singles.entries()) {
				this.saving = { done: i + (news.length ? 1 : 0), total: singles.length + (news.length ? 1 : 0), name: p.name };
				const r = await this.saveOne(p, message);
				if (!r) return;
				reports.push(r);
				this.saveReports = [...reports];
				await this.storeSeamEdits(p);
			}
			this.past = [];
			this.future = [];
			this.announce = `Saved ${reports.map((r) => `${r.name} version ${r.number}`).join(', ')}.`;
			await this.refreshSeamPairs();
		} finally {
			this.saving = null;
			this.namingDone = false;
		}
	}

	/** The naming dialog's answer: the new pieces take their names and cuts, then the save goes on. */
	async namingConfirm(entries: readonly { key: string; name: string; cut: CutInstruction }[]): Promise<void> {
		const problem = namingProblem(entries, changeSourceNames(this.doc));
		if (problem) {
			this.namingError = problem;
			return;
		}
		for (const e of entries) {
			const name = e.name.trim();
			this.doc = docReplacePiece(this.doc, e.key, (q) => ({ ...q, name, cut: e.cut, base: q.base && pieceRenamed(q.base, name, e.cut), geometry: pieceRenamed(q.geometry, name, e.cut) }));
		}
		this.naming = null;
		this.namingError = null;
		this.namingDone = true;
		await this.save(this.namingMessage);
	}
	namingCancel() {
		this.naming = null;
		this.namingError = null;
	}

	/** Every pending multi-piece step as one style change: all stored, or nothing (the server's answer). */
	private async saveChange(message: string): Promise<SaveReport[] | null> {
		const built = changeBodyBuild(this.doc, message, (p) => this.recipeOf(p), (p) => this.declaredOf(p));
		if (typeof built === 'string') {
			this.saveError = built;
			return null;
		}
		try {
			const r = await changeSave(this.studioId, this.styleId, built.body);
			const reports: SaveReport[] = [];
			for (const [i, key] of built.newKeys.entries()) {
				const p = this.piece(key)!;
				const made = r.pieces[i];
				const head = made.versions[made.versions.length - 1];
				this.pieceRekey(key, { ...p, key: made.id, base: p.geometry, baseVersionId: head.id, baseNumber: head.number, steps: [], origin: null });
				reports.push({ pieceKey: made.id, name: p.name, number: head.number, message, checks: r.checks, warnings: r.warnings });
			}
			this.doc = { ...this.doc, pendingSteps: [], pendingSeams: [] };
			return reports;
		} catch (e) {
			const why = e instanceof Error ? e.message : String(e);
			this.saveError = e instanceof ApiFailure && e.status === 409 ? `The change was not saved: ${why}` : `The change was not saved: ${why} Your edits are kept.`;
			return null;
		}
	}

	/** Puts a piece's new state in place of the old (its key changes when a new piece is first stored). */
	private pieceRekey(oldKey: string, next: PieceEdit): void {
		const key = next.key;
		this.doc = docReplacePiece(this.doc, oldKey, () => next);
		if (key !== oldKey && this.doc.pendingSeams?.length) {
			const k = (x: string) => (x === oldKey ? key : x);
			this.doc = { ...this.doc, pendingSeams: this.doc.pendingSeams.map((sp) => ({ ...sp, a: { ...sp.a, pieceKey: k(sp.a.pieceKey) }, b: { ...sp.b, pieceKey: k(sp.b.pieceKey) } })) };
		}
		if (this.selection.pieceKey === oldKey) this.selection.pieceKey = key;
	}

	private async saveOne(p: PieceEdit, message: string): Promise<SaveReport | null> {
		try {
			const key = p.key;
			const r: SaveResult = await versionSave(this.studioId, p.key, { baseVersionId: p.baseVersionId, message, geometry: p.geometry, recipe: this.recipeOf(p), declared: this.declaredOf(p) });
			this.pieceRekey(p.key, { ...p, key, base: p.geometry, baseVersionId: r.version.id, baseNumber: r.version.number, steps: [], origin: null });
			return { pieceKey: key, name: p.name, number: r.version.number, message, checks: r.checks, warnings: r.warnings };
		} catch (e) {
			if (e instanceof ApiFailure && e.status === 409) {
				await this.openConflict(p, e, message);
				this.saveError = `${p.name}: ${e.message}`;
			} else {
				this.saveError = `${p.name} was not saved: ${e instanceof Error ? e.message : String(e)} Your edits are kept.`;
			}
			return null;
		}
	}

	/** A saved piece's trued seams: move the stored pairs' edge ends so the server measures the trued edges. */
	private async storeSeamEdits(p: PieceEdit): Promise<void> {
		// the last edit of each edge wins
		const edits = new Map<string, SeamEdit>();
		for (const st of p.steps) if (st.seamEdit) edits.set(`${st.seamEdit.seamPairId}:${st.seamEdit.side}`, st.seamEdit);
		for (const e of edits.values()) {
			try {
				await seamPairPatch(this.studioId, this.styleId, e.seamPairId, { [e.side]: { from: e.from, to: e.to } });
			} catch (err) {
				const name = this.seamPairs.find((x) => x.id === e.seamPairId)?.label || 'a seam pair';
				this.saveError = `${p.name} was saved, but ${name} still has its old edge ends: ${err instanceof Error ? err.message : String(err)}`;
			}
		}
	}

	/** Re-read the style's seam pairs (after storing or moving them). */
	async refreshSeamPairs(): Promise<void> {
		try {
			this.seamPairs = (await styleLoad(this.studioId, this.styleId)).seamPairs;
		} catch {
			/* the old list stays until the next load */
		}
	}

	private async openConflict(p: PieceEdit, e: ApiFailure, saveMessage: string) {
		let head: Piece | null = null;
		let headId = e.headers?.get('x-head-version') ?? '';
		let headNumber = Number(e.headers?.get('x-head-number') ?? 0);
		let headMessage = '';
		let headAuthor = '';
		try {
			const d = await pieceLoad(this.studioId, p.key);
			head = d.shown?.geometry ?? null;
			headId = d.shown?.id ?? headId;
			headNumber = d.shown?.number ?? headNumber;
			const v = d.versions.find((x) => x.id === headId);
			headMessage = v?.message ?? '';
			headAuthor = v?.authorName ?? '';
		} catch {
			/* shown without details */
		}
		this.conflict = { pieceKey: p.key, name: p.name, message: e.message, headId, headNumber, head, headMessage, headAuthor, saveMessage };
	}

	/** Drop my steps on this piece and take the server's head. */
	conflictReload() {
		const c = this.conflict;
		if (!c || !c.head) return;
		this.doc = docReplacePiece(this.doc, c.pieceKey, (q) => ({ ...q, base: c.head, geometry: c.head!, baseVersionId: c.headId, baseNumber: c.headNumber, steps: [] }));
		this.past = [];
		this.future = [];
		this.conflict = null;
		this.saveError = null;
		this.announce = `Reloaded version ${c.headNumber} of ${c.name}.`;
	}

	/** Re-apply my steps on the server's head, then save on top of it. */
	async conflictSaveOnTop(): Promise<void> {
		const c = this.conflict;
		const p = c && this.piece(c.pieceKey);
		if (!c || !p || !c.head) return;
		let g = c.head;
		const steps: StepRecord[] = [];
		for (const [i, s] of p.steps.entries()) {
			const r = editorApply(g, { op: s.op, params: s.params });
			if (!r.ok) {
				this.saveError = `Step ${i + 1} (${s.op}) does not apply to version ${c.headNumber}: ${r.error.message} Your edits are kept; reload or change the step.`;
				return;
			}
			g = r.piece;
			steps.push({ ...s, ledger: r.ledgerEntries, summary: r.report.summary, notes: r.report.notes });
		}
		this.doc = docReplacePiece(this.doc, c.pieceKey, (q) => ({ ...q, base: c.head, geometry: g, baseVersionId: c.headId, baseNumber: c.headNumber, steps }));
		this.conflict = null;
		this.saveError = null;
		await this.save(c.saveMessage);
	}

	/** A world-space bounding box of every visible piece (for rulers and tests). */
	piecesBox() {
		let box = BOUNDING_BOX_EMPTY;
		for (const p of this.visible) {
			const b = pathBoundingBox(p.geometry.outline);
			box = boundingBoxUnion(box, { minX: b.minX + p.offset.x, minY: b.minY + p.offset.y, maxX: b.maxX + p.offset.x, maxY: b.maxY + p.offset.y });
		}
		return box;
	}
}

/** A piece made by a multi-piece step in the editor, not saved yet: its history starts with the style change. */
function pieceEditNew(key: string, g: Piece, offset: Vec): PieceEdit {
	return {
		key,
		name: g.name,
		cut: g.cut,
		fabric: g.fabric,
		baseVersionId: null,
		baseNumber: 0,
		base: g,
		geometry: g,
		steps: [],
		offset,
		origin: { op: 'change_result' },
		retired: false,
		readOnly: false
	};
}
