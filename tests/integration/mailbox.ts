// An in-process fake SMTP server for tests: keeps every message it receives, parsed.
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface ReceivedMail {
	to: string[];
	from: string;
	subject: string;
	text: string;
	html: string;
	links: string[];
}

export interface Mailbox {
	port: number;
	messages: ReceivedMail[];
	/** Waits for the first message to `to` (after `since` messages) and returns it. */
	waitFor(to: string, timeoutMs?: number): Promise<ReceivedMail>;
	close(): Promise<void>;
}

export function linksIn(text: string): string[] {
	return [...new Set(text.match(/https?:\/\/[^\s"'<>]+/g) ?? [])];
}

export async function startMailbox(): Promise<Mailbox> {
	const messages: ReceivedMail[] = [];
	const server = new SMTPServer({
		authOptional: true,
		disabledCommands: ['STARTTLS'],
		logger: false,
		onData(stream, session, callback) {
			simpleParser(stream)
				.then((mail) => {
					const text = mail.text ?? '';
					messages.push({
						to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
						from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
						subject: mail.subject ?? '',
						text,
						html: typeof mail.html === 'string' ? mail.html : '',
						links: linksIn(text)
					});
					callback();
				})
				.catch((e: Error) => callback(e));
		}
	});
	await new Promise<void>((resolve, reject) => {
		server.once('error', reject);
		server.listen(0, '127.0.0.1', () => resolve());
	});
	const port = ((server as unknown as { server: { address(): AddressInfo } }).server.address()).port;
	return {
		port,
		messages,
		async waitFor(to, timeoutMs = 5000) {
			const want = to.toLowerCase();
			const start = Date.now();
			for (;;) {
				const m = messages.find((x) => x.to.includes(want));
				if (m) {
					messages.splice(messages.indexOf(m), 1);
					return m;
				}
				if (Date.now() - start > timeoutMs) throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
				await new Promise((r) => setTimeout(r, 25));
			}
		},
		close: () => new Promise<void>((resolve) => server.close(() => resolve()))
	};
}
