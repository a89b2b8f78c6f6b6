import { sql, type AliasedRawBuilder } from 'kysely';

/** How work is attributed once its author's account is deleted (the author column is then NULL). */
export const FORMER_MEMBER = 'former member';

/** The author's name from a left-joined users column, or "former member" when the account is gone. */
export function authorName<A extends string>(column: string, alias: A): AliasedRawBuilder<string, A> {
	return sql<string>`coalesce(${sql.ref(column)}, ${FORMER_MEMBER})`.as(alias);
}
