import { outlineNearestLocation, vecDistance, vecSub, type Vec } from '../kernel';
import { seamLocate } from '../piece-seams';
import type { Anchor, AnchorBody, EdgeAnchor, LandmarkAnchor } from './anchor';
import { landmarkAt } from './landmarks';

/**
 * The anchor of an absolute point on the body it was made on (how an old step's points, stored as
 * coordinates, become anchors). The rules, in order:
 *  1. within LANDMARK_SNAP_MM of a landmark (an apex, a corner) → that landmark;
 *  2. on the stitching line (within EDGE_SNAP_MM) of a named seam → that seam, by fraction of its length
 *     from its start (a point a third of the way along the shoulder stays a third of the way along);
 *  3. anywhere else → an offset from the nearest apex (shaping lines keep their place relative to the
 *     shaping), or from the nearest landmark when the piece has no apex.
 * Null only for a body with no landmark at all.
 */

export const LANDMARK_SNAP_MM = 0.01;
/** The same snap the operations use to put a given point on the outline. */
export const EDGE_SNAP_MM = 0.5;

/** The anchor of a point on one body (`piece` is the body's index when a step spans pieces). */
export function anchorInfer(body: AnchorBody, p: Vec, piece?: number): Anchor | null {
	return anchorInferAmong([body], p, piece === undefined ? undefined : [piece]);
}

/**
 * The anchor of a point among the sources of a step: a landmark of any of them, else a seam of the one
 * whose stitching line is nearest, else an offset from the nearest apex of any. `indices` are the
 * bodies' indices as the anchor names them (left out for a single-piece step).
 */
export function anchorInferAmong(bodies: readonly AnchorBody[], p: Vec, indices?: readonly number[]): Anchor | null {
	const on = (k: number) => (indices === undefined ? {} : { piece: indices[k] });
	for (const [k, body] of bodies.entries()) {
		const l = landmarkAt(body.landmarks, p, LANDMARK_SNAP_MM);
		if (l) return { kind: 'landmark', name: l.name, ...on(k) };
	}
	let best: { k: number; d: number } | null = null;
	for (const [k, body] of bodies.entries()) {
		const d = outlineNearestLocation(body.piece.outline, p).distance;
		if (d <= EDGE_SNAP_MM && (best === null || d < best.d)) best = { k, d };
	}
	if (best) {
		const body = bodies[best.k];
		const loc = seamLocate(body.piece, body.seams, p, EDGE_SNAP_MM);
		if (loc) {
			const seam = body.seams[loc.seamIndex];
			const fraction = seam.lengthMm > 0 ? Math.min(1, Math.max(0, loc.fromStartMm / seam.lengthMm)) : 0;
			const edge: EdgeAnchor = { kind: 'edge', edge: seam.name, from: 'start', fraction, ...on(best.k) };
			return edge;
		}
		// on a wedge leg rather than a seam: falls through to an offset
	}
	let from: { k: number; name: string; point: Vec } | null = null;
	const anyApex = bodies.some((b) => b.landmarks.some((x) => x.kind === 'apex'));
	for (const [k, body] of bodies.entries()) {
		for (const l of body.landmarks) {
			if (anyApex && l.kind !== 'apex') continue;
			if (from === null || vecDistance(l.point, p) < vecDistance(from.point, p)) from = { k, name: l.name, point: l.point };
		}
	}
	if (!from) return null;
	const d = vecSub(p, from.point);
	const of: LandmarkAnchor = { kind: 'landmark', name: from.name, ...on(from.k) };
	return { kind: 'offset', of, dxMm: d.x, dyMm: d.y };
}
