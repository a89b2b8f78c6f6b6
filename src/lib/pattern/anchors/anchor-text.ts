import { vecDistance } from '../kernel';
import { anchorSchema, type Anchor, type AnchorBody } from './anchor';

/**
 * What a point is anchored to, in the trade's words and in the person's unit (`length` formats mm):
 * "bust point", "side seam, 40 % from the waist", "120.0 mm from the side neck point along the shoulder",
 * "offset 12.0 mm right, 5.0 mm down from the bust point". The body names the seams' ends; without it
 * (or for a seam it does not have) the ends are said as the seam's start and end. Pure.
 */

/** A landmark's name as said: apex ids are written with hyphens ("bust-point" → "bust point"). */
export function landmarkWords(name: string): string {
	return name.replace(/-/g, ' ');
}

const pct = (f: number) => {
	const v = f * 100;
	return `${Math.abs(v - Math.round(v)) < 0.05 ? Math.round(v).toFixed(0) : v.toFixed(1)} %`;
};

/** The corner landmark at one end of a seam, when the body has one there. */
function endLandmark(body: AnchorBody, edge: string, from: 'start' | 'end'): string | null {
	const seam = body.seams.find((s) => s.name === edge);
	if (!seam) return null;
	const at = from === 'start' ? seam.start : seam.end;
	const l = body.landmarks.find((x) => x.kind === 'corner' && vecDistance(x.point, at) < 1e-6);
	return l ? landmarkWords(l.name) : null;
}

function neighbour(body: AnchorBody | null, edge: string, from: 'start' | 'end'): string {
	const seam = body?.seams.find((s) => s.name === edge);
	if (!seam) return `its ${from}`;
	return `the ${from === 'start' ? seam.startNeighbour : seam.endNeighbour}`;
}

/** An anchor as a short line for the editor. */
export function anchorText(a: Anchor, body: AnchorBody | null, length: (mm: number) => string): string {
	if (a.kind === 'landmark') return landmarkWords(a.name);
	if (a.kind === 'edge') {
		if (a.fraction !== undefined) {
			const f = a.from === 'start' ? a.fraction : 1 - a.fraction;
			const from = f <= 0.5 ? 'start' : 'end';
			return `${a.edge}, ${pct(from === 'start' ? f : 1 - f)} from ${neighbour(body, a.edge, from)}`;
		}
		const d = a.distanceMm ?? 0;
		const corner = body ? endLandmark(body, a.edge, a.from) : null;
		return corner ? `${length(d)} from the ${corner} along the ${a.edge}` : `${length(d)} along the ${a.edge} from ${neighbour(body, a.edge, a.from)}`;
	}
	const parts: string[] = [];
	if (Math.abs(a.dxMm) >= 0.05) parts.push(`${length(Math.abs(a.dxMm))} ${a.dxMm > 0 ? 'right' : 'left'}`);
	if (Math.abs(a.dyMm) >= 0.05) parts.push(`${length(Math.abs(a.dyMm))} ${a.dyMm > 0 ? 'down' : 'up'}`);
	const of = anchorText(a.of, body, length);
	return parts.length ? `offset ${parts.join(', ')} from the ${of}` : of;
}

/** The anchors a step's parameters carry (points without one are left out), in the order they come. */
export function stepAnchorsGiven(params: unknown): Anchor[] {
	const out: Anchor[] = [];
	const visit = (v: unknown) => {
		if (Array.isArray(v)) return v.forEach(visit);
		if (typeof v !== 'object' || v === null) return;
		const o = v as Record<string, unknown>;
		if (typeof o.x === 'number' && typeof o.y === 'number' && o.anchor !== undefined) {
			const a = anchorSchema.safeParse(o.anchor);
			if (a.success) out.push(a.data);
			return;
		}
		Object.values(o).forEach(visit);
	};
	visit(params);
	return out;
}
