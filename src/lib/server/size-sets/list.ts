import type { DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { sizeSetSizesOf, sizeSetsOfStyle } from '../repositories/size-sets';
import { sizeSetView, sizesShown } from './view';

/** A style's size sets as the role sees them (the sample room: sets with a signed-off size, those sizes only). */
export async function sizeSetsOfStyleShown(db: DbOrTx, studioId: string, styleId: string, role: Role) {
	const sets = await sizeSetsOfStyle(db, studioId, styleId);
	const sizes = sizesShown(await sizeSetSizesOf(db, sets.map((s) => s.id)), role);
	return sets.map((s) => sizeSetView(s, sizes)).filter((v) => v.sizes.length > 0);
}
