import type { LedgerEntry, ShapingCheck } from '$lib/pattern/ledger';
import { parsePiece } from '$lib/pattern/piece';
import type { CutInstruction, Piece } from '$lib/pattern/piece-schema';
import type { RecipeStepData } from '$lib/pattern/verify/version-verify';
import type { ChangeBody } from './change-save';

/** The editor's calls to the versions API (JSON; errors as `{ error: { code, message, fields? } }`). */

export interface ShownVersion {
	readonly id: string;
	readonly number: number;
	readonly state: string;
	readonly geometry: Piece;
	readonly checks: readonly ShapingCheck[];
}

export interface StylePiece {
	readonly id: string;
	readonly name: string;
	readonly cut: CutInstruction;
	readonly fabric: string;
	readonly headVersionId: string | null;
	readonly headNumber: number;
	readonly shown: ShownVersion | null;
}

export interface SeamPairInfo {
	readonly id: string;
	readonly label: string;
	readonly aPieceId: string;
	readonly aEdge: { from: { x: number; y: number }; to: { x: number; y: number } };
	readonly bPieceId: string;
	readonly bEdge: { from: { x: number; y: number }; to: { x: number; y: number } };
	readonly allowedEaseMm: number;
	readonly toleranceMm: number;
}

export interface StyleData {
	readonly style: { id: string; name: string; code?: string };
	readonly pieces: readonly StylePiece[];
	readonly seamPairs: readonly SeamPairInfo[];
}

export class ApiFailure extends Error {
	constructor(
		readonly status: number,
		readonly code: string,
		message: string,
		readonly fields: Record<string, string[]> | undefined,
		readonly headers: Headers | null
	) {
		super(message);
	}
}

async function call<T>(url: string, init?: RequestInit): Promise<T> {
	let r: Response;
	try {
		r = await fetch(url, { ...init, headers: { 'content-type': 'application/json', accept: 'application/json', ...(init?.headers ?? {}) } });
	} catch {
		throw new ApiFailure(0, 'network', 'The server could not be reached. Your edits are kept; try again.', undefined, null);
	}
	let body: unknown = null;
	try {
		body = await r.json();
	} catch {
		/* not JSON */
	}
	if (!r.ok) {
		const e = (body as { error?: { code?: string; message?: string; fields?: Record<string, string[]> } } | null)?.error;
		throw new ApiFailure(r.status, e?.code ?? `http_${r.status}`, e?.message ?? `The server answered ${r.status}.`, e?.fields, r.headers);
	}
	return body as T;
}

function shownOf(raw: unknown): ShownVersion | null {
	if (!raw) return null;
	const s = raw as ShownVersion;
	return { ...s, geometry: parsePiece(s.geometry), checks: s.checks ?? [] };
}

export async function styleLoad(studioId: string, styleId: string): Promise<StyleData> {
	const d = await call<StyleData>(`/api/studios/${studioId}/styles/${styleId}`);
	return { ...d, pieces: d.pieces.map((p) => ({ ...p, shown: shownOf(p.shown) })) };
}

export interface PieceData {
	readonly piece: { id: string; name: string; headVersionId: string | null; headNumber: number };
	readonly versions: readonly { id: string; number: number; message: string; authorName?: string; createdAt?: string }[];
	readonly shown: ShownVersion | null;
}

export async function pieceLoad(studioId: string, pieceId: string): Promise<PieceData> {
	const d = await call<PieceData>(`/api/studios/${studioId}/pieces/${pieceId}`);
	return { ...d, shown: shownOf(d.shown) };
}

export interface SaveResult {
	readonly version: { id: string; number: number };
	readonly checks: readonly ShapingCheck[];
	readonly warnings: readonly { seamPairId: string; label: string; message: string }[];
}

export async function versionSave(
	studioId: string,
	pieceId: string,
	body: { baseVersionId: string | null; message: string; geometry: Piece; recipe: readonly RecipeStepData[]; declared?: readonly LedgerEntry[] }
): Promise<SaveResult> {
	return call<SaveResult>(`/api/studios/${studioId}/pieces/${pieceId}/versions`, { method: 'POST', body: JSON.stringify(body) });
}

export interface ChangeResult {
	readonly change: { id: string };
	readonly pieces: readonly { id: string; name: string; versions: readonly { id: string; number: number }[] }[];
	readonly checks: readonly (ShapingCheck & { step?: number })[];
	readonly warnings: readonly { seamPairId: string; label: string; message: string }[];
}

/** Save the editor's multi-piece steps as one style change (all stored, or nothing). */
export async function changeSave(studioId: string, styleId: string, body: ChangeBody): Promise<ChangeResult> {
	return call(`/api/studios/${studioId}/styles/${styleId}/changes`, { method: 'POST', body: JSON.stringify(body) });
}

type XY = { x: number; y: number };
export interface SeamPairSide {
	readonly pieceId: string;
	readonly from: XY;
	readonly to: XY;
}

/** Store a seam pair (edge ends in each piece's outline order): the user pairs two seams of stored pieces. */
export async function seamPairCreate(
	studioId: string,
	styleId: string,
	body: { label: string; a: SeamPairSide; b: SeamPairSide; allowedEaseMm: number; toleranceMm: number }
): Promise<{ seamPair: SeamPairInfo }> {
	return call(`/api/studios/${studioId}/styles/${styleId}/seam-pairs`, { method: 'POST', body: JSON.stringify(body) });
}

/** Unpair: remove a stored seam pair (the pieces stay as they are). */
export async function seamPairDelete(studioId: string, styleId: string, seamPairId: string): Promise<void> {
	await call<null>(`/api/studios/${studioId}/styles/${styleId}/seam-pairs/${seamPairId}`, { method: 'DELETE' });
}

/** Move a stored seam pair's edge ends (after truing) or change its ease and tolerance. */
export async function seamPairPatch(
	studioId: string,
	styleId: string,
	seamPairId: string,
	body: { label?: string; a?: { from: XY; to: XY }; b?: { from: XY; to: XY }; allowedEaseMm?: number; toleranceMm?: number }
): Promise<{ seamPair: SeamPairInfo }> {
	return call(`/api/studios/${studioId}/styles/${styleId}/seam-pairs/${seamPairId}`, { method: 'PATCH', body: JSON.stringify(body) });
}
