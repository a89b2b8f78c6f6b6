import { COLORS } from '$lib/palette';
import { jsonError } from '../http-errors';
import { DATABASE_RETRY_AFTER_S, DATABASE_UNAVAILABLE_MESSAGE } from './unavailable';

/** The API's answer while the database is away: 503 with a Retry-After. */
export function databaseUnavailableJson(): Response {
	return jsonError(503, 'unavailable', DATABASE_UNAVAILABLE_MESSAGE, undefined, {
		'retry-after': String(DATABASE_RETRY_AFTER_S)
	});
}

/**
 * The page a person sees while the database is away. It stands alone (no layout, no data: the
 * layout's own load needs the database) and tries again by itself.
 */
export function databaseUnavailablePage(): Response {
	const html = `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="refresh" content="${DATABASE_RETRY_AFTER_S * 3}">
<title>Dartelier is catching its breath</title>
<style>
body{margin:0;background:${COLORS.paper.DEFAULT};color:${COLORS.ink.DEFAULT};font-family:"Source Sans 3",system-ui,sans-serif}
main{max-width:34rem;margin:12vh auto;padding:0 1.5rem}
h1{font-size:1.6rem;margin:0 0 .75rem}
p{line-height:1.5}
a{color:${COLORS.indigo.dark}}
</style>
</head>
<body>
<main>
<h1>The studio's database is not reachable right now</h1>
<p>Dartelier could not reach its database, so this page cannot be shown. Your work that was saved
before is kept. This page tries again by itself every ${DATABASE_RETRY_AFTER_S * 3} seconds, or
<a href="">try again now</a>.</p>
<p>If you were saving a change, reload its page first to see whether it was stored.</p>
</main>
</body>
</html>`;
	return new Response(html, {
		status: 503,
		headers: { 'content-type': 'text/html; charset=utf-8', 'retry-after': String(DATABASE_RETRY_AFTER_S) }
	});
}
