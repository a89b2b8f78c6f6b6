/**
 * Where a result holds a number that is not finite (NaN, ±Infinity) or a message that prints one: the
 * operations refuse rather than hand such a result on (a reading like "NaN mm" must never reach a user).
 * Returns the path of the first such value, or null.
 */
export function nonFiniteAt(value: unknown, path = 'result', seen: Set<object> = new Set()): string | null {
	if (typeof value === 'number') return Number.isFinite(value) ? null : path;
	if (typeof value === 'string') return /\b(NaN|-?Infinity)\b/.test(value) ? path : null;
	if (value === null || typeof value !== 'object') return null;
	if (seen.has(value)) return null;
	seen.add(value);
	if (Array.isArray(value)) {
		for (let i = 0; i < value.length; i++) {
			const at = nonFiniteAt(value[i], `${path}[${i}]`, seen);
			if (at) return at;
		}
		return null;
	}
	for (const [k, v] of Object.entries(value)) {
		const at = nonFiniteAt(v, `${path}.${k}`, seen);
		if (at) return at;
	}
	return null;
}
