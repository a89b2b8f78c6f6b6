import { z } from 'zod';
import { pdfFonts } from '$lib/export/pdf-fonts';
import { printPdf } from '$lib/export/pdf-writer';
import { PAPER_KEYS, type PaperKey } from '$lib/export/paper';
import { printSheet } from '$lib/export/print-sheet';
import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { fileSlug, styleExportPieces } from './style-pieces';

/** The print options, as the query string of export.pdf carries them. */
export const printQuerySchema = z.object({
	paper: z.enum(PAPER_KEYS as [PaperKey, ...PaperKey[]], 'Choose a paper: a4, letter, a3, a0 or roll914.').default('a4'),
	pieces: z
		.string()
		.optional()
		.transform((s) => (s ? s.split(',').filter(Boolean) : undefined))
		.pipe(z.array(z.uuid('Not a valid piece id.')).max(500).optional()),
	allowance: z.enum(['shown', 'hidden'], 'Choose shown or hidden.').default('shown'),
	pairs: z.enum(['both', 'once'], 'Choose both or once.').default('both')
});
export type PrintQuery = z.output<typeof printQuerySchema>;

export async function stylePrintPdf(db: DbOrTx, studioId: string, styleId: string, role: Role, q: PrintQuery) {
	const { style, pieces } = await styleExportPieces(db, studioId, styleId, role, q.pieces);
	const title = style.code ? `${style.code} ${style.name}` : style.name;
	const sheet = printSheet(
		pieces.map((p) => ({ piece: p.piece, meta: p.meta })),
		{ paper: q.paper, allowanceShown: q.allowance === 'shown', pairs: q.pairs },
		title
	);
	const bytes = await printPdf(sheet, pdfFonts());
	return { bytes, fileName: `${fileSlug(style.code || style.name)}-${q.paper}.pdf`, pages: sheet.tiling };
}
