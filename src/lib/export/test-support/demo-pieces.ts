import { demoPath, DEMO_STYLE } from '$lib/pattern/fixtures/demo-path';
import type { PrintPieceInput } from '../print-sheet';

let cached: PrintPieceInput[] | undefined;

/** The demo style's pieces at their last versions, labelled as the server labels them. */
export function demoPrintPieces(): PrintPieceInput[] {
	cached ??= demoPath().pieces.map((p) => ({
		piece: p.later.at(-1)?.geometry ?? p.first.geometry,
		meta: {
			styleName: DEMO_STYLE.name,
			styleCode: DEMO_STYLE.code,
			sizeLabel: 'ASTM D5585 curvy 10',
			versionNumber: 1 + p.later.length,
			versionState: 'signed_off',
			fabric: 'self'
		}
	}));
	return cached;
}
