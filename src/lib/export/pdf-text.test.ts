// Labels in other scripts: Source Sans 3's script parts (Latin, Latin extended, Greek, Cyrillic,
// Vietnamese) are embedded where the text needs them; what no part has is printed as a visible '?'.
import { describe, expect, it } from 'vitest';
import { PDFDict, PDFDocument, PDFName } from 'pdf-lib';
import { demoPrintPieces } from './test-support/demo-pieces';
import { pdfRead } from './test-support/pdf-read';
import { MISSING_GLYPH, pdfFonts, unprintableCharacters } from './pdf-fonts';
import { printPdf } from './pdf-writer';
import { printSheet } from './print-sheet';

const NAMES = {
	polish: 'Gorset Żółć — przód łączony',
	greek: 'Κορσές μπούστο',
	cyrillic: 'Корсет лиф — перёд',
	vietnamese: 'Áo nịt ngực — thân trước'
};

async function printedWith(styleName: string, pieceName: string) {
	const [first] = demoPrintPieces();
	const sheet = printSheet([{ piece: { ...first.piece, name: pieceName }, meta: { ...first.meta, styleName } }], { paper: 'a3', allowanceShown: true, pairs: 'once' }, styleName);
	const bytes = await printPdf(sheet, pdfFonts());
	const pages = await pdfRead(bytes);
	const doc = await PDFDocument.load(bytes);
	const fonts: string[] = [];
	for (const [, obj] of doc.context.enumerateIndirectObjects()) {
		if (obj instanceof PDFDict && obj.get(PDFName.of('Type')) === PDFName.of('Font') && obj.get(PDFName.of('Subtype')) === PDFName.of('Type0')) {
			fonts.push(obj.get(PDFName.of('BaseFont'))!.toString());
		}
	}
	return { text: pages.map((p) => p.text.join('')).join('\n'), fonts };
}

describe('labels in other scripts', () => {
	for (const [script, name] of Object.entries(NAMES)) {
		it(`prints a ${script} style and piece name letter for letter, in Source Sans 3`, async () => {
			const { text, fonts } = await printedWith(name, name);
			expect(text).toContain(name.normalize('NFC'));
			expect(unprintableCharacters([name])).toEqual([]);
			for (const f of fonts) expect(f).toMatch(/^\/SourceSans3-/);
			// the Latin part and the script's own, each in two weights
			if (script !== 'polish') expect(fonts.length).toBeGreaterThanOrEqual(4);
		}, 30_000);
	}

	it('embeds only the Latin part for Latin text', async () => {
		const { fonts } = await printedWith('Juniper corset bodice', 'Upper front');
		// one regular and one bold font, each a subset of the Latin part
		expect(fonts).toHaveLength(2);
	}, 30_000);

	it('prints a character the font lacks as a visible replacement, and names it', async () => {
		const name = 'Juniper 紬 bodice';
		const { text } = await printedWith(name, 'Upper front');
		expect(text).toContain(`Juniper ${MISSING_GLYPH} bodice`);
		expect(unprintableCharacters([name, 'Upper front'])).toEqual(['紬']);
	}, 30_000);
});
