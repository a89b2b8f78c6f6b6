import { ImportRefusal } from '../import-model';

/** The refusal an import throws, for tests of what it refuses and why (fails if it does not refuse). */
export function importRefusal(f: () => unknown): ImportRefusal {
	try {
		f();
	} catch (e) {
		if (e instanceof ImportRefusal) return e;
		throw e;
	}
	throw new Error('not refused');
}
