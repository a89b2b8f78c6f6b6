// Export speed: the demo style (its pieces at their last versions) to a tiled A4 PDF and to DXF, and a
// 50-piece style (the demo's pieces repeated) to a tiled A4 PDF. Whole exports from pieces to bytes:
// layout, labels, drawing, font subsetting and writing; the database reads are not included.
import { bench, describe } from 'vitest';
import { styleDxf } from '../../src/lib/export/dxf-writer';
import { pdfFonts } from '../../src/lib/export/pdf-fonts';
import { printPdf } from '../../src/lib/export/pdf-writer';
import { printSheet } from '../../src/lib/export/print-sheet';
import { demoPrintPieces } from '../../src/lib/export/test-support/demo-pieces';

const demo = demoPrintPieces();
const fifty = Array.from({ length: 50 }, (_, i) => {
	const d = demo[i % demo.length];
	return { ...d, piece: { ...d.piece, id: `${d.piece.id}-${i}`, name: `${d.piece.name} ${i + 1}` } };
});
const options = { paper: 'a4', allowanceShown: true, pairs: 'both' } as const;

describe('exports', () => {
	bench('demo style → tiled A4 PDF (target ≤ 1 s)', async () => {
		await printPdf(printSheet(demo, options, 'LR-214 Juniper corset bodice'), pdfFonts());
	}, { iterations: 5, warmupIterations: 1 });

	bench('demo style → DXF (target ≤ 100 ms)', () => {
		styleDxf(demo.map(({ piece, meta }) => ({ piece, styleName: meta.styleName, sizeLabel: meta.sizeLabel, quantity: piece.cut === 'pair' ? 2 : 1, category: meta.fabric })));
	}, { iterations: 10, warmupIterations: 2 });

	bench('50-piece style → tiled A4 PDF (target ≤ 5 s)', async () => {
		await printPdf(printSheet(fifty, options, '50 pieces'), pdfFonts());
	}, { iterations: 3, warmupIterations: 1 });
});
