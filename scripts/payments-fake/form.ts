// The provider's request encoding: application/x-www-form-urlencoded with bracketed keys, as the SDK
// writes it (`line_items[0][price]=…&metadata[studio_id]=…`), read back into nested objects and arrays.

export type FormValue = string | FormValue[] | { [key: string]: FormValue };
export type FormObject = { [key: string]: FormValue };

function keyPath(key: string): string[] {
	const first = key.indexOf('[');
	if (first < 0) return [key];
	const parts = [key.slice(0, first)];
	for (const m of key.slice(first).matchAll(/\[([^\]]*)\]/g)) parts.push(m[1]);
	return parts;
}

function put(target: FormObject, path: string[], value: string): void {
	let node: FormObject = target;
	for (let i = 0; i < path.length - 1; i++) {
		const k = path[i] === '' ? String(Object.keys(node).length) : path[i];
		const next = node[k];
		if (typeof next !== 'object' || next === null) node[k] = {};
		node = node[k] as FormObject;
	}
	const last = path[path.length - 1];
	node[last === '' ? String(Object.keys(node).length) : last] = value;
}

/** Objects whose keys are 0, 1, 2… become arrays, all the way down. */
function arrays(v: FormValue): FormValue {
	if (typeof v === 'string') return v;
	if (Array.isArray(v)) return v.map(arrays);
	const keys = Object.keys(v);
	const out: FormObject = {};
	for (const k of keys) out[k] = arrays(v[k]);
	if (keys.length > 0 && keys.every((k, i) => k === String(i))) return keys.map((k) => out[k]);
	return out;
}

export function formParse(text: string): FormObject {
	const out: FormObject = {};
	for (const [k, v] of new URLSearchParams(text)) put(out, keyPath(k), v);
	return arrays(out) as FormObject;
}

export const str = (v: FormValue | undefined): string | undefined => (typeof v === 'string' ? v : undefined);
export const obj = (v: FormValue | undefined): FormObject => (v && typeof v === 'object' && !Array.isArray(v) ? v : {});
export const list = (v: FormValue | undefined): FormValue[] => (Array.isArray(v) ? v : v && typeof v === 'object' ? Object.values(v) : []);
export const bool = (v: FormValue | undefined): boolean | undefined => (v === 'true' ? true : v === 'false' ? false : undefined);
export const int = (v: FormValue | undefined): number | undefined => (typeof v === 'string' && /^\d+$/.test(v) ? Number(v) : undefined);

/** Metadata: string values only, as the provider keeps them. */
export function metadataOf(v: FormValue | undefined): Record<string, string> {
	const out: Record<string, string> = {};
	for (const [k, x] of Object.entries(obj(v))) if (typeof x === 'string') out[k] = x;
	return out;
}
