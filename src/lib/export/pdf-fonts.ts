// Source Sans 3 (latin), as the app ships it, inlined into the server bundle: fontkit reads WOFF (not WOFF2).
import regularUrl from '@fontsource/source-sans-3/files/source-sans-3-latin-400-normal.woff?inline';
import boldUrl from '@fontsource/source-sans-3/files/source-sans-3-latin-600-normal.woff?inline';
import type { PdfFonts } from './pdf-writer';

function dataUrlBytes(url: string): Uint8Array {
	const base64 = url.slice(url.indexOf(',') + 1);
	return Uint8Array.from(atob(base64), (c) => c.charCodeAt(0));
}

let fonts: PdfFonts | undefined;

/** The fonts embedded (and subset) in every PDF export. */
export function pdfFonts(): PdfFonts {
	fonts ??= { regular: dataUrlBytes(regularUrl), bold: dataUrlBytes(boldUrl) };
	return fonts;
}
