import { vecCross, vecLerp, vecSub, type Vec } from './kernel';
import { centreMark } from './operations/still-side';
import type { Dart, Piece } from './piece-schema';

type LegSide = 'leg1' | 'leg2';

/**
 * Which leg a sewn dart is pressed toward, by the trade's rule: vertical darts toward the centre
 * (front or back), horizontal darts downward (reference-values row 11, Erwin 1954 p. 30, C).
 * A dart is vertical when its centre line runs closer to the piece's up-down than to across; pieces are
 * drafted upright (y down is down the body). The centre is the fold line, else the centre front or back
 * label; a vertical dart on a piece with neither has no side by the rule and gets none.
 */
export function dartPressByPractice(piece: Piece, dart: Dart): LegSide | undefined {
	const apex = piece.apexes.find((a) => a.id === dart.apexId);
	if (!apex) return undefined;
	const mouth = vecLerp(dart.leg1End, dart.leg2End, 0.5);
	const axis = vecSub(mouth, apex.point);
	const side = (p: Vec) => vecCross(axis, vecSub(p, apex.point));
	const s1 = side(dart.leg1End);
	const s2 = side(dart.leg2End);
	if (s1 === 0 || s2 === 0 || Math.sign(s1) === Math.sign(s2)) return undefined;
	let target: number;
	if (Math.abs(axis.y) >= Math.abs(axis.x)) {
		const centre = piece.foldLine ? vecLerp(piece.foldLine.from, piece.foldLine.to, 0.5) : centreMark(piece)?.point;
		if (!centre) return undefined;
		target = side(centre);
	} else {
		target = vecCross(axis, { x: 0, y: 1 });
	}
	if (target === 0) return undefined;
	return Math.sign(target) === Math.sign(s1) ? 'leg1' : 'leg2';
}

/** The piece with every dart that has no pressing direction given the one of common practice. */
export function piecePressByPractice(piece: Piece): Piece {
	if (!piece.darts.some((d) => !d.pressToward)) return piece;
	return {
		...piece,
		darts: piece.darts.map((d) => {
			if (d.pressToward) return d;
			const pressToward = dartPressByPractice(piece, d);
			return pressToward ? { ...d, pressToward } : d;
		})
	};
}

/** What a move tells the pattern cutter about the pressing direction it gave a dart. */
export function pressPracticeNote(dartId: string, pressToward: LegSide | undefined): string {
	return pressToward
		? `Dart "${dartId}" is pressed toward ${pressToward === 'leg1' ? 'leg 1' : 'leg 2'} by common practice (vertical darts toward the centre, horizontal darts down); change it with Cap if the design wants otherwise.`
		: `Dart "${dartId}" has no pressing direction: the piece marks no centre front or back to press it toward.`;
}
