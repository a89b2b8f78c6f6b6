/**
 * A size set's name from its sizes' names, short enough to read as a title: chart rows of one chart are
 * written once with their sizes listed ("ASTM D5585 misses, curvy waist, sizes 6, 8, 12"), other sets
 * (clients) by their own names, groups joined by "; ", at most `maxLength` characters (an ellipsis
 * where cut).
 */
export function sizeSetName(sizeNames: readonly string[], maxLength = 120): string {
	const groups = new Map<string, string[]>();
	const order: string[] = [];
	for (const name of sizeNames) {
		const m = /^(.*\S),? size (\S+)$/.exec(name);
		const key = m ? m[1] : `\u0000${name}`;
		if (!groups.has(key)) {
			groups.set(key, []);
			order.push(key);
		}
		groups.get(key)!.push(m ? m[2] : name);
	}
	const parts = order.map((key) => {
		const sizes = groups.get(key)!;
		if (key.startsWith('\u0000')) return sizes[0];
		return `${key.replace(/,$/, '')}, ${sizes.length > 1 ? 'sizes' : 'size'} ${sizes.join(', ')}`;
	});
	const name = parts.join('; ') || 'Size set';
	return name.length <= maxLength ? name : `${name.slice(0, maxLength - 1).trimEnd()}…`;
}
