/**
 * The demo subscription's current period, the same for the local payments fake and the database seed:
 * it starts on the first day of the current month (UTC) and runs one month. Pure.
 */
export function demoPeriod(nowMs: number): { startS: number; endS: number } {
	const d = new Date(nowMs);
	const start = Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 1);
	const end = Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 1);
	return { startS: start / 1000, endS: end / 1000 };
}

/** The start of the period `back` months before the current one (for the demo's earlier invoices). */
export function demoPeriodBefore(nowMs: number, back: number): number {
	const d = new Date(nowMs);
	return Date.UTC(d.getUTCFullYear(), d.getUTCMonth() - back, 1) / 1000;
}
