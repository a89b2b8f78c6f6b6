import { degrees, type Color, type PDFDocument, type PDFFont, type PDFPage } from 'pdf-lib';
import { faceCharacters, MISSING_GLYPH, printedText, type PdfFonts } from './pdf-fonts';

/** A part of the font embedded in one PDF (null where no text of the document needs it). */
interface EmbeddedFace {
	readonly regular: PDFFont;
	readonly bold: PDFFont;
	readonly chars: ReadonlySet<number>;
}

/** The fonts of one PDF: the parts in matching order, the first (Latin) always embedded. */
export interface PdfTextFonts {
	readonly faces: readonly (EmbeddedFace | null)[];
}

/** Which part prints each character: the part of the run so far when it has it, else the first that has it. */
function faceFor(sets: readonly ReadonlySet<number>[], c: number, current: number): number {
	if (current >= 0 && sets[current].has(c)) return current;
	return sets.findIndex((s) => s.has(c));
}

/**
 * Embeds (subset) the parts of the font that the given texts need. A character no part has is printed as
 * MISSING_GLYPH in the Latin part.
 */
export async function pdfTextFonts(doc: PDFDocument, faces: PdfFonts, texts: Iterable<string>): Promise<PdfTextFonts> {
	const sets = faces.map(faceCharacters);
	const needed = new Set<number>([0]);
	for (const t of texts) {
		let current = 0;
		for (const ch of printedText(t)) {
			const i = faceFor(sets, ch.codePointAt(0)!, current);
			if (i >= 0) needed.add((current = i));
		}
	}
	const out: (EmbeddedFace | null)[] = [];
	for (let i = 0; i < faces.length; i++) {
		if (!needed.has(i)) {
			out.push(null);
			continue;
		}
		const regular = await doc.embedFont(faces[i].regular, { subset: true });
		const bold = await doc.embedFont(faces[i].bold, { subset: true });
		out.push({ regular, bold, chars: sets[i] });
	}
	return { faces: out };
}

/** The text cut into runs, each printed with one part of the font. */
export function textRuns(fonts: PdfTextFonts, text: string): { text: string; face: number }[] {
	const sets = fonts.faces.map((f) => f?.chars ?? new Set<number>());
	const runs: { text: string; face: number }[] = [];
	let current = -1;
	for (const ch of printedText(text)) {
		let i = faceFor(sets, ch.codePointAt(0)!, current);
		const shown = i >= 0 ? ch : MISSING_GLYPH;
		if (i < 0) i = 0;
		if (runs.length && i === current) runs[runs.length - 1].text += shown;
		else runs.push({ text: shown, face: i });
		current = i;
	}
	return runs;
}

/** Draws text at (x, y) in page points, run after run, turned 90° counter-clockwise when asked. */
export function textDraw(page: PDFPage, fonts: PdfTextFonts, text: string, o: { x: number; y: number; size: number; bold?: boolean; color: Color; turned?: boolean }) {
	let along = 0;
	for (const run of textRuns(fonts, text)) {
		const face = fonts.faces[run.face]!;
		const font = o.bold ? face.bold : face.regular;
		page.drawText(run.text, {
			x: o.turned ? o.x : o.x + along,
			y: o.turned ? o.y + along : o.y,
			size: o.size,
			font,
			color: o.color,
			rotate: o.turned ? degrees(90) : undefined
		});
		along += font.widthOfTextAtSize(run.text, o.size);
	}
}
