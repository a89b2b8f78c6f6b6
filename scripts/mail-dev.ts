// Local mail catcher for development: a fake SMTP server and a small inbox page.
//   npx tsx scripts/mail-dev.ts
// SMTP on 127.0.0.1:${MAIL_DEV_SMTP_PORT:-2526} (point the app at it with SMTP_HOST=127.0.0.1,
// SMTP_PORT=2526), inbox on http://127.0.0.1:${MAIL_DEV_HTTP_PORT:-4174}/ (JSON: /messages.json).
// Messages are kept in .run/mail/ (one JSON file each) so they survive a restart; nothing is relayed.
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

const SMTP_PORT = Number(process.env.MAIL_DEV_SMTP_PORT ?? 2526);
const HTTP_PORT = Number(process.env.MAIL_DEV_HTTP_PORT ?? 4174);
const HOST = '127.0.0.1';
const DIR = path.resolve(process.cwd(), '.run/mail');
const KEEP = 200;

interface Message {
	id: string;
	receivedAt: string;
	from: string;
	to: string[];
	subject: string;
	text: string;
	links: string[];
}

mkdirSync(DIR, { recursive: true });
const messages: Message[] = readdirSync(DIR)
	.filter((f) => f.endsWith('.json'))
	.sort()
	.flatMap((f) => {
		try {
			return [JSON.parse(readFileSync(path.join(DIR, f), 'utf8')) as Message];
		} catch {
			return [];
		}
	});

function store(m: Message) {
	messages.push(m);
	writeFileSync(path.join(DIR, `${m.id}.json`), JSON.stringify(m, null, 2));
	while (messages.length > KEEP) rmSync(path.join(DIR, `${messages.shift()!.id}.json`), { force: true });
}

const smtp = new SMTPServer({
	authOptional: true,
	disabledCommands: ['STARTTLS'],
	logger: false,
	onData(stream, session, callback) {
		simpleParser(stream)
			.then((mail) => {
				const text = mail.text ?? '';
				const m: Message = {
					id: `${Date.now()}-${Math.random().toString(36).slice(2, 8)}`,
					receivedAt: new Date().toISOString(),
					from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
					to: session.envelope.rcptTo.map((r) => r.address),
					subject: mail.subject ?? '(no subject)',
					text,
					links: [...new Set(text.match(/https?:\/\/[^\s"'<>]+/g) ?? [])]
				};
				store(m);
				console.log(`[mail-dev] ${m.to.join(', ')}: ${m.subject}`);
				callback();
			})
			.catch((e: Error) => callback(e));
	}
});

const esc = (s: string) =>
	s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function page(): string {
	const rows = [...messages]
		.reverse()
		.map(
			(m) => `<article>
  <header><strong>${esc(m.subject)}</strong><span>${esc(m.to.join(', '))} · ${esc(new Date(m.receivedAt).toLocaleString())}</span></header>
  ${m.links.map((l) => `<p class="link"><a href="${esc(l)}">${esc(l)}</a></p>`).join('')}
  <details><summary>Text</summary><pre>${esc(m.text)}</pre></details>
</article>`
		)
		.join('\n');
	return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Dartelier dev inbox (${messages.length})</title>
<style>
body{font:15px/1.4 system-ui,sans-serif;background:#F7F3EA;color:#1F2A37;margin:0 auto;max-width:56rem;padding:1.5rem}
h1{font-size:1.2rem;display:flex;justify-content:space-between;align-items:center}
article{border:1px solid #E4DED0;background:#fff;border-radius:4px;padding:.6rem .8rem;margin:.5rem 0}
header{display:flex;justify-content:space-between;gap:1rem}header span{color:#1F2A37aa;font-size:.85rem}
a{color:#2F4B7C;word-break:break-all}pre{white-space:pre-wrap;font-size:.85rem}
button{border:1px solid #E4DED0;background:#fff;border-radius:4px;padding:.2rem .6rem;cursor:pointer}
</style></head><body>
<h1>Dev inbox <form method="post" action="/clear"><button>Clear</button></form></h1>
<p>SMTP on ${HOST}:${SMTP_PORT}. Newest first; nothing here leaves this machine.</p>
${rows || '<p>No messages yet.</p>'}
</body></html>`;
}

const web = http.createServer((req, res) => {
	const url = new URL(req.url ?? '/', `http://${HOST}:${HTTP_PORT}`);
	const headers = {
		'x-content-type-options': 'nosniff',
		'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'; form-action 'self'; frame-ancestors 'none'"
	};
	if (req.method === 'GET' && url.pathname === '/') {
		res.writeHead(200, { ...headers, 'content-type': 'text/html; charset=utf-8' }).end(page());
	} else if (req.method === 'GET' && url.pathname === '/messages.json') {
		res.writeHead(200, { ...headers, 'content-type': 'application/json' }).end(JSON.stringify([...messages].reverse()));
	} else if (req.method === 'POST' && url.pathname === '/clear') {
		for (const m of messages.splice(0)) rmSync(path.join(DIR, `${m.id}.json`), { force: true });
		res.writeHead(303, { ...headers, location: '/' }).end();
	} else {
		res.writeHead(404, { ...headers, 'content-type': 'text/plain' }).end('Not Found');
	}
});

smtp.listen(SMTP_PORT, HOST, () => console.log(`[mail-dev] SMTP on ${HOST}:${SMTP_PORT}`));
web.listen(HTTP_PORT, HOST, () => console.log(`[mail-dev] inbox on http://${HOST}:${HTTP_PORT}/`));

function stop() {
	smtp.close(() => web.close(() => process.exit(0)));
	setTimeout(() => process.exit(0), 1000).unref();
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
