import type { BoundingBox, Vec } from '$lib/geometry';
import { ledgerBalance, type LedgerEntry } from '$lib/pattern/ledger';
import { pieceMetrics } from '$lib/pattern/metrics';
import { recipeStepApply } from '$lib/pattern/recipe/registry';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';
import { versionVerify } from '$lib/pattern/verify/version-verify';
import { styleLoad, type SeamPairInfo } from './api';
import type { EditorDoc } from './doc';
import { PAPER_GRID_MM } from './paint-grid';
import { hitTest, snapPoint, type Hit, type Snap, type SnapOptions } from './hit';
import type { MoveContext } from './moves/context';
import { moveDef, MOVES, type MoveState } from './moves/registry';
import type { CommitOutcome, MoveId, MovePreview, PointerInfo } from './moves/types';
import { Camera, type SettingsStore } from './state/camera.svelte';
import type { Offer } from './moves/offers';
import { offerStart } from './moves/offer-start';
import { declaredOf, docStepApply, recipeOf, type DocEdit, type StepExtras } from './state/doc-edits';
import { DocumentStore } from './state/document.svelte';
import { piecesBoxOf, piecesLaidOut } from './state/layout';
import { SaveSession } from './state/save-session.svelte';
import { Selection } from './state/selection.svelte';

/**
 * The editor of one style, for one page: the document store, the camera, the selection, the move under
 * way (its own state) and the save session, given to every part by context. Moves see only `ctx`.
 */
export class EditorState {
	readonly studioId: string;
	readonly styleId: string;
	readonly canEdit: boolean;

	styleName = $state('');
	loading = $state(true);
	loadError = $state<string | null>(null);
	seamPairs = $state.raw<readonly SeamPairInfo[]>([]);

	readonly docs = new DocumentStore();
	readonly selection = new Selection();
	readonly camera: Camera;
	readonly save: SaveSession;
	readonly ctx: MoveContext;

	move = $state<MoveState>({ id: 'select', drag: null });
	moveMessage = $state<string | null>(null);
	showCut = $state(true);
	helpOpen = $state(false);
	calibrateOpen = $state(false);
	announce = $state('');

	constructor(studioId: string, styleId: string, canEdit: boolean, settings: SettingsStore | null = typeof localStorage === 'undefined' ? null : localStorage) {
		// eslint-disable-next-line @typescript-eslint/no-this-alias
		const self = this;
		this.studioId = studioId;
		this.styleId = styleId;
		this.canEdit = canEdit;
		this.camera = new Camera(() => this.contentBox(), settings);
		this.save = new SaveSession({
			studioId,
			styleId,
			docs: this.docs,
			get seamPairs() {
				return self.seamPairs;
			},
			seamPairsRefresh: () => this.refreshSeamPairs(),
			rekeyed: (a, b) => this.selection.rekey(a, b),
			announce: (t) => (this.announce = t)
		});
		this.ctx = {
			get unit() {
				return self.camera.unit;
			},
			get seamPairs() {
				return self.seamPairs;
			},
			get paperGridMm() {
				return PAPER_GRID_MM[self.camera.paperGrid];
			},
			get visible() {
				return self.docs.visible;
			},
			get selectedKey() {
				return self.selection.pieceKey;
			},
			get selection() {
				return self.selection;
			},
			piece: (key) => this.docs.piece(key),
			local: (key, world) => {
				const o = this.docs.offsetOf(key);
				return { x: world.x - o.x, y: world.y - o.y };
			},
			tolMm: (px) => this.camera.tolMm(px),
			snapAt: (world, opts) => this.snapAt(world, opts),
			showSnap: (snap) => (this.selection.snapShown = snap),
			select: (key) => (this.selection.pieceKey = key),
			selectHit: (hit) => this.selection.hit(hit),
			selectPart: (key, part) => this.selection.part(key, part),
			togglePanel: (key) => this.selection.togglePanel(key),
			apply: (key, step, extras) => this.apply(key, step, extras),
			edit: (make) => this.edit((doc) => make(doc, Date.now().toString(36))),
			dragChange: (make) => this.dragChange(make),
			dragEnd: (label) => this.dragEnd(label),
			announce: (t) => (this.announce = t)
		};
	}

	// ---------- derived ----------
	selected = $derived(this.docs.visible.find((p) => p.key === this.selection.pieceKey) ?? null);
	preview = $derived.by<MovePreview | null>(() => moveDef(this.move).preview?.(this.ctx, this.move) ?? null);
	/** Undo and redo have something to do: in the document's history, or in the move under way (a reshape's drags). */
	canUndo = $derived(this.docs.past.length > 0 || (this.move.id === 'reshape' && this.move.past.length > 0));
	canRedo = $derived(this.docs.future.length > 0 || (this.move.id === 'reshape' && this.move.future.length > 0));
	/** A piece being moved on the table and where it would go. */
	moving = $derived.by(() => {
		const d = this.move.id === 'select' ? this.move.drag : null;
		const p = d?.moved ? this.docs.piece(d.key) : null;
		return d && p ? { key: d.key, offset: p.offset } : null;
	});

	/** The selected piece's shape and steps: the same values while only its place on the table changes (a drag). */
	private selGeometry = $derived(this.selected?.geometry ?? null);
	private selSteps = $derived(this.selected?.steps ?? null);
	private selBase = $derived(this.selected?.base ?? null);
	/** Metrics of the selected piece (the preview's result while a move previews on it). */
	selectedMetrics = $derived.by(() => {
		const g = this.selGeometry;
		if (!g) return null;
		const pv = this.preview;
		return pieceMetrics(pv?.piece && pv.pieceKey === this.selection.pieceKey ? pv.piece : g);
	});
	/** Ledger entries since the base version (with the preview's, if it previews on the selected piece). */
	selectedLedger = $derived.by<LedgerEntry[]>(() => {
		const steps = this.selSteps;
		if (!steps) return [];
		const entries = steps.flatMap((s) => s.ledger);
		const pv = this.preview;
		if (pv?.piece && pv.pieceKey === this.selection.pieceKey) entries.push(...pv.ledger);
		return entries;
	});
	selectedBalance = $derived(ledgerBalance(this.selectedLedger));
	/** The checks the server will run on save (versionVerify in the browser). */
	selectedVerify = $derived.by(() => {
		const [g, steps, base] = [this.selGeometry, this.selSteps, this.selBase];
		if (!g || !steps || steps.length === 0 || !base) return null;
		const p = { steps };
		return versionVerify(base, g, recipeOf(p), recipeStepApply, declaredOf(p));
	});

	// ---------- loading ----------
	async load(): Promise<void> {
		this.loading = true;
		this.loadError = null;
		try {
			const d = await styleLoad(this.studioId, this.styleId);
			this.styleName = d.style.name;
			this.seamPairs = d.seamPairs;
			const pieces = piecesLaidOut(d.pieces, this.canEdit);
			this.docs.reset({ pieces });
			if (pieces.length && !this.selection.pieceKey) this.selection.pieceKey = pieces[0].key;
			this.camera.fit();
		} catch (e) {
			this.loadError = e instanceof Error ? e.message : 'The style could not be loaded.';
		} finally {
			this.loading = false;
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

	// ---------- the table ----------
	hitAt(world: Vec): Hit | null {
		return hitTest(this.docs.placed, world, this.camera.tolMm(7));
	}
	snapAt(world: Vec, opts: SnapOptions = {}): Snap {
		return snapPoint(this.docs.placed, world, this.camera.tolMm(9), { grid: true, ...opts }, { gridMm: PAPER_GRID_MM[this.camera.paperGrid] });
	}
	/** Everything on the table, cut lines included (for fitting the view). */
	contentBox = (): BoundingBox => piecesBoxOf(this.docs.visible, true);
	/** A world-space bounding box of every visible piece's stitching line (for rulers and tests). */
	piecesBox = (): BoundingBox => piecesBoxOf(this.docs.visible, false);

	// ---------- changes (each one undo step) ----------
	private edit(make: (doc: EditorDoc) => DocEdit): string | null {
		const r = make(this.docs.doc);
		if (!r.ok) return r.error;
		this.docs.push(r.doc, r.label);
		this.save.changed();
		this.announce = r.label;
		if (r.select !== undefined) this.selection.piece(r.select);
		return null;
	}
	/** A drag's change: the document follows the pointer inside an open history mark. */
	private dragChange(make: (doc: EditorDoc) => DocEdit): string | null {
		const r = make(this.docs.doc);
		if (!r.ok) return r.error;
		if (!this.docs.marking) this.docs.begin();
		this.docs.update(r.doc);
		return null;
	}
	/** The drag ended: one undo step back to the document at its mark. */
	private dragEnd(label: string) {
		if (!this.docs.commit(label)) return;
		this.save.changed();
		this.announce = label;
	}
	apply(key: string, step: RecipeStepData, extras?: StepExtras): string | null {
		return this.edit((doc) => docStepApply(doc, key, step, extras));
	}
	undo() {
		// inside a move, its own last step first (a reshape's last drag)
		const inMove = this.docs.marking ? null : (moveDef(this.move).undo?.(this.ctx, this.move) ?? null);
		if (inMove !== null) return void (this.announce = `Undone: ${inMove}`);
		const label = this.docs.undo();
		if (label === null) return;
		this.cancelMove();
		this.announce = `Undone: ${label}`;
		this.selection.fix(this.docs.visible);
	}
	redo() {
		const inMove = this.docs.marking ? null : (moveDef(this.move).redo?.(this.ctx, this.move) ?? null);
		if (inMove !== null) return void (this.announce = `Redone: ${inMove}`);
		const label = this.docs.redo();
		if (label === null) return;
		this.cancelMove();
		this.announce = `Redone: ${label}`;
		this.selection.fix(this.docs.visible);
	}

	// ---------- moves ----------
	setMove(id: MoveId) {
		const def = MOVES[id];
		if (def.edits && !this.canEdit) return;
		const st = (def.fresh as (c: MoveContext) => MoveState)(this.ctx);
		this.move = st;
		moveDef(this.move).begin?.(this.ctx, this.move);
		this.moveMessage = null;
		this.announce = `${def.name} tool`;
	}
	/** Start the move over (what was picked is dropped, the piece stays). */
	cancelMove() {
		this.docs.rollback();
		this.move = moveDef(this.move).fresh(this.ctx);
		this.selection.snapShown = null;
		this.moveMessage = null;
	}
	escape() {
		if (this.helpOpen) this.helpOpen = false;
		else if (this.calibrateOpen) this.calibrateOpen = false;
		else if (this.docs.marking) this.cancelMove();
		else if (this.move.id !== 'select' && moveDef(this.move).started(this.move)) this.cancelMove();
		else if (this.move.id !== 'select') this.setMove('select');
		else this.selection.clearPart();
	}
	/** Apply the move under way (Enter, Apply). */
	commitMove() {
		const def = moveDef(this.move);
		if (def.commit) this.settle(def.commit(this.ctx, this.move));
	}
	/** What a commit (or a form's own button) did: a refusal is shown, a done move starts again or ends. */
	settle(o: CommitOutcome) {
		if (!o.done) {
			this.moveMessage = o.error;
			return;
		}
		this.moveMessage = null;
		if (o.then === 'select') this.setMove('select');
		else this.move = moveDef(this.move).fresh(this.ctx, this.move);
		if (o.announce) this.announce = o.announce;
	}
	pointerDown(p: PointerInfo): boolean {
		return moveDef(this.move).down?.(this.ctx, this.move, p) ?? false;
	}
	pointerMove(p: PointerInfo) {
		moveDef(this.move).move?.(this.ctx, this.move, p);
	}
	pointerUp(p: PointerInfo, moved: boolean) {
		const then = moveDef(this.move).up?.(this.ctx, this.move, p, moved);
		if (then === 'commit' && this.preview?.canCommit) this.commitMove();
	}
	/** An offered move chosen (its button, its key): it starts on what is selected. */
	offerStart(o: Offer) {
		offerStart(this, o);
	}
	/** A piece picked in a form: the move starts over on it. */
	moveOnPiece(key: string) {
		this.selection.piece(key);
		this.move = moveDef(this.move).fresh(this.ctx);
	}
}
