// The app's log, as it runs: the BUILT app as its own process with every log line captured (LOG_LEVEL
// info), driven through sign-up, sign-in (a wrong password too), a password reset by e-mail, sign-in
// with the new password and API requests. Checked: one JSON line per request with its request id (the
// one its response carried), route, status, duration, user and studio; and nowhere in the whole log a
// password, a session cookie's value, the reset link's token or the database's password.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { appProcessStart, type AppProcess } from './app-process';
import { Client, uniq } from './helpers';
import { startMailbox, type Mailbox } from './mailbox';

const FIRST_PASSWORD = 'selvage-and-grain-71';
const WRONG_PASSWORD = 'not-my-password-303';
const NEW_PASSWORD = 'bias-bound-armhole-58';

let app: AppProcess;
let mailbox: Mailbox;

beforeAll(async () => {
	mailbox = await startMailbox();
	app = await appProcessStart(inject('databaseUrl'), {
		LOG_LEVEL: 'info',
		SMTP_HOST: '127.0.0.1',
		SMTP_PORT: String(mailbox.port),
		MAIL_FROM: 'Dartelier tests <tests@dartelier.localhost>'
	});
}, 60_000);

afterAll(async () => {
	await app?.stop();
	await mailbox?.close();
});

interface Line {
	level: string;
	msg: string;
	requestId?: string;
	route?: string | null;
	status?: number;
	durationMs?: number;
	userId?: string | null;
	studioId?: string | null;
}

function logLines(): Line[] {
	return app
		.output()
		.split('\n')
		.filter((l) => l.startsWith('{'))
		.map((l) => JSON.parse(l) as Line);
}

describe('the log of a running app', () => {
	it('has a line per request with its id, and no password, session cookie, reset token or database password', async () => {
		const email = `logged-${uniq()}@example.test`;
		const secrets: string[] = [FIRST_PASSWORD, WRONG_PASSWORD, NEW_PASSWORD, 'dartelier-local-only'];

		const c = new Client(app.baseUrl);
		const signup = await c.post('/signup', { name: 'Lena Logged', email, password: FIRST_PASSWORD, studioName: 'Logged Atelier' });
		expect(signup.status).toBe(303);
		const studioId = signup.headers.get('location')!.split('/')[2];
		secrets.push(c.session!);
		const me = await c.api('GET', '/api/me');
		expect(me.status).toBe(200);
		const style = await c.api('POST', `/api/studios/${studioId}/styles`, { name: 'Logged shift', code: 'LG-1', season: 'SS28' });
		expect(style.status).toBe(201);
		expect((await c.get(`/studios/${studioId}`)).status).toBe(200);

		const wrong = new Client(app.baseUrl);
		expect((await wrong.post('/signin', { email, password: WRONG_PASSWORD })).status).toBe(400);
		const again = new Client(app.baseUrl);
		expect((await again.post('/signin', { email, password: FIRST_PASSWORD })).status).toBe(303);
		secrets.push(again.session!);

		const asker = new Client(app.baseUrl);
		expect((await asker.post('/reset', { email })).status).toBe(200);
		const link = (await mailbox.waitFor(email)).links.find((l) => l.startsWith(`${app.baseUrl}/reset/`))!;
		const path = link.slice(app.baseUrl.length);
		secrets.push(path.split('/').pop()!);
		expect((await asker.get(path)).status).toBe(200);
		expect((await asker.post(path, { password: NEW_PASSWORD, confirm: NEW_PASSWORD })).status).toBe(303);
		secrets.push(asker.session!);
		const last = new Client(app.baseUrl);
		expect((await last.post('/signin', { email, password: NEW_PASSWORD })).status).toBe(303);
		secrets.push(last.session!);
		const final = await last.api('GET', `/api/studios/${studioId}/styles`);
		expect(final.status).toBe(200);
		const finalId = final.headers.get('x-request-id')!;

		// the last request's line is written once its answer is ready
		await expect.poll(() => logLines().some((l) => l.requestId === finalId), { timeout: 5000 }).toBe(true);
		const requests = logLines().filter((l) => l.msg === 'request');
		expect(requests.length).toBeGreaterThanOrEqual(12);
		for (const l of requests) {
			expect(l.requestId).toMatch(/^[0-9a-f-]{36}$/);
			expect(typeof l.status).toBe('number');
			expect(l.durationMs).toBeGreaterThanOrEqual(0);
		}
		const line = requests.find((l) => l.requestId === finalId)!;
		expect(line).toMatchObject({ route: '/api/studios/[studioId]/styles', status: 200, studioId });
		expect(line.userId).toMatch(/^[0-9a-f-]{36}$/);
		expect(requests.some((l) => l.route === '/(auth)/reset/[token]' && l.status === 303)).toBe(true);

		const whole = app.output();
		for (const s of secrets) {
			expect(s.length).toBeGreaterThanOrEqual(12);
			expect(whole.includes(s), `a secret of ${s.length} characters is in the log`).toBe(false);
		}
	});
});
