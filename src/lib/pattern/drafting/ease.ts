/**
 * Wearing ease added to body girths (whole body, mm). Defaults from reference-values row 23
 * (costume construction text, S): fitted bodice bust 1½–2 in, waist ¾–1 in. We take the upper end
 * of each span: bust 2 in = 50.8 mm, waist 1 in = 25.4 mm. Both are editable.
 */
export interface Ease {
	readonly bustMm: number;
	readonly waistMm: number;
	/** Only for close-fitting boned work; informational for cautions. */
	readonly underbustMm?: number;
}

export const EASE_DEFAULT: Ease = { bustMm: 50.8, waistMm: 25.4 };

export const EASE_SOURCE =
	'Wearing ease for a fitted bodice, bust 1½–2 in and waist ¾–1 in (a costume construction text, secondary source); defaults take 2 in and 1 in.';

export interface DraftCaution {
	readonly code: 'negative_ease' | 'large_reduction' | 'toile_first' | 'maker_practice';
	readonly message: string;
}

/**
 * The trade's usual cautions for a boned, close-fitting block (primer, "Cautions customary in the
 * trade"): negative ease is flagged; a first corset is customarily limited to about 5–8 cm (~10 %) of
 * waist reduction; make a toile first; the maker's own practice comes first. Empty when no girth
 * has negative ease. `waistMm` (body waist) lets the 10 % figure be stated.
 */
export function draftCautions(ease: Ease, body?: { waistMm?: number }): DraftCaution[] {
	const negatives: string[] = [];
	if (ease.waistMm < 0) negatives.push(`waist ${(ease.waistMm / 10).toFixed(1)} cm`);
	if (ease.underbustMm !== undefined && ease.underbustMm < 0) negatives.push(`under-bust ${(ease.underbustMm / 10).toFixed(1)} cm`);
	if (ease.bustMm < 0) negatives.push(`bust ${(ease.bustMm / 10).toFixed(1)} cm`);
	if (negatives.length === 0) return [];
	const cautions: DraftCaution[] = [
		{
			code: 'negative_ease',
			message: `Negative ease (${negatives.join(', ')}): this block compresses the body. It is for a boned, close-fitting garment only.`
		}
	];
	const reductionMm = Math.max(0, -ease.waistMm);
	const tenPercent = body?.waistMm !== undefined ? body.waistMm * 0.1 : undefined;
	if (reductionMm > 50 || (tenPercent !== undefined && reductionMm > tenPercent)) {
		cautions.push({
			code: 'large_reduction',
			message: `Waist reduction of ${(reductionMm / 10).toFixed(1)} cm. The usual advice is to limit a first corset to about 5–8 cm (around 10 % of the waist${
				tenPercent !== undefined ? `, here ${(tenPercent / 10).toFixed(1)} cm` : ''
			}) and never to compress the ribcage in a woven without stretch.`
		});
	}
	cautions.push({
		code: 'toile_first',
		message: 'Make and fit a toile in inexpensive cloth before cutting the final fabric.'
	});
	cautions.push({
		code: 'maker_practice',
		message: 'These are general trade cautions; the maker’s own practice and the wearer’s comfort take precedence.'
	});
	return cautions;
}
