import type { LengthUnit } from '$lib/pattern/measurements/units';
import { unitChoose, unitChosen } from '$lib/fittings/amount';

/**
 * The unit this person chose for lengths, as page state: null until read from the browser (so the
 * server's page and the first paint use the measurement set's unit), then the remembered choice.
 * Give one to a page's components; `read()` in an effect, `choose()` from a unit menu.
 */
export class UnitChoice {
	chosen = $state<LengthUnit | null>(null);

	read(): void {
		this.chosen = unitChosen();
	}

	choose(u: LengthUnit): void {
		this.chosen = u;
		unitChoose(u);
	}
}
