// Source Sans 3, as the app ships it (@fontsource/source-sans-3), inlined into the server bundle: fontkit
// reads WOFF (not WOFF2). The package splits the font by script; every part is shipped, and a PDF embeds
// (subset) only the parts its text needs.
import latin400 from '@fontsource/source-sans-3/files/source-sans-3-latin-400-normal.woff?inline';
import latin600 from '@fontsource/source-sans-3/files/source-sans-3-latin-600-normal.woff?inline';
import latinExt400 from '@fontsource/source-sans-3/files/source-sans-3-latin-ext-400-normal.woff?inline';
import latinExt600 from '@fontsource/source-sans-3/files/source-sans-3-latin-ext-600-normal.woff?inline';
import greek400 from '@fontsource/source-sans-3/files/source-sans-3-greek-400-normal.woff?inline';
import greek600 from '@fontsource/source-sans-3/files/source-sans-3-greek-600-normal.woff?inline';
import greekExt400 from '@fontsource/source-sans-3/files/source-sans-3-greek-ext-400-normal.woff?inline';
import greekExt600 from '@fontsource/source-sans-3/files/source-sans-3-greek-ext-600-normal.woff?inline';
import cyrillic400 from '@fontsource/source-sans-3/files/source-sans-3-cyrillic-400-normal.woff?inline';
import cyrillic600 from '@fontsource/source-sans-3/files/source-sans-3-cyrillic-600-normal.woff?inline';
import cyrillicExt400 from '@fontsource/source-sans-3/files/source-sans-3-cyrillic-ext-400-normal.woff?inline';
import cyrillicExt600 from '@fontsource/source-sans-3/files/source-sans-3-cyrillic-ext-600-normal.woff?inline';
import vietnamese400 from '@fontsource/source-sans-3/files/source-sans-3-vietnamese-400-normal.woff?inline';
import vietnamese600 from '@fontsource/source-sans-3/files/source-sans-3-vietnamese-600-normal.woff?inline';
import fontkit from '@pdf-lib/fontkit';

/** One script part of the font, in the two weights the print uses. */
export interface PdfFontFace {
	readonly script: string;
	readonly regular: Uint8Array;
	readonly bold: Uint8Array;
}

/** The parts in the order text is matched to them: the first (Latin) is always embedded. */
export type PdfFonts = readonly PdfFontFace[];

/** Printed in place of a character none of the parts has (it stays visible, and the options page warns). */
export const MISSING_GLYPH = '?';

function dataUrlBytes(url: string): Uint8Array {
	const base64 = url.slice(url.indexOf(',') + 1);
	return Uint8Array.from(atob(base64), (c) => c.charCodeAt(0));
}

const FACES: [string, string, string][] = [
	['latin', latin400, latin600],
	['latin-ext', latinExt400, latinExt600],
	['greek', greek400, greek600],
	['greek-ext', greekExt400, greekExt600],
	['cyrillic', cyrillic400, cyrillic600],
	['cyrillic-ext', cyrillicExt400, cyrillicExt600],
	['vietnamese', vietnamese400, vietnamese600]
];

let fonts: PdfFonts | undefined;

/** The fonts embedded (and subset) in every PDF export. */
export function pdfFonts(): PdfFonts {
	fonts ??= FACES.map(([script, r, b]) => ({ script, regular: dataUrlBytes(r), bold: dataUrlBytes(b) }));
	return fonts;
}

const coverage = new WeakMap<PdfFontFace, ReadonlySet<number>>();

/** Code points a part has in both weights. */
export function faceCharacters(face: PdfFontFace): ReadonlySet<number> {
	let set = coverage.get(face);
	if (!set) {
		const bold = new Set(fontkit.create(face.bold).characterSet);
		set = new Set(fontkit.create(face.regular).characterSet.filter((c) => bold.has(c)));
		coverage.set(face, set);
	}
	return set;
}

/** Text as it is printed: composed (NFC), so accented letters find their glyph. */
export const printedText = (text: string) => text.normalize('NFC');

/** Characters of the texts that no part of the font has (each once, in order of first use). */
export function unprintableCharacters(texts: Iterable<string>, faces: PdfFonts = pdfFonts()): string[] {
	const sets = faces.map(faceCharacters);
	const out = new Set<string>();
	for (const t of texts) {
		for (const ch of printedText(t)) {
			const c = ch.codePointAt(0)!;
			if (/\s/.test(ch) || sets.some((s) => s.has(c))) continue;
			out.add(ch);
		}
	}
	return [...out];
}
