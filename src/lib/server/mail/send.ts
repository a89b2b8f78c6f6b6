import nodemailer from 'nodemailer';
import { roleLabel, type Role } from '../../roles';

export interface Mail {
	to: string;
	subject: string;
	text: string;
	html?: string;
}

/**
 * Sends through SMTP as configured in the environment, read at send time (so tests and scripts can
 * point it at a fake server after the app has started):
 *   SMTP_HOST (default 127.0.0.1), SMTP_PORT (default 2526, the dev inbox of scripts/mail-dev.ts),
 *   MAIL_FROM (default "Dartelier <no-reply@dartelier.localhost>"),
 *   optional SMTP_USER / SMTP_PASS, SMTP_SECURE=true for implicit TLS (port 465).
 */
export async function mailSend(mail: Mail): Promise<void> {
	const env = process.env;
	const port = Number(env.SMTP_PORT ?? 2526);
	const transport = nodemailer.createTransport({
		host: env.SMTP_HOST ?? '127.0.0.1',
		port,
		secure: env.SMTP_SECURE === 'true',
		auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASS ?? '' } : undefined,
		connectionTimeout: 10_000,
		greetingTimeout: 10_000,
		socketTimeout: 20_000
	});
	try {
		await transport.sendMail({
			from: env.MAIL_FROM ?? 'Dartelier <no-reply@dartelier.localhost>',
			to: mail.to,
			subject: mail.subject,
			text: mail.text,
			html: mail.html
		});
	} finally {
		transport.close();
	}
}

function escapeHtml(s: string): string {
	return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function linkMail(to: string, subject: string, lines: string[], link: string, after: string): Mail {
	const text = [...lines, '', link, '', after, '', '— Dartelier'].join('\n');
	const html = [
		...lines.map((l) => `<p>${escapeHtml(l)}</p>`),
		`<p><a href="${escapeHtml(link)}">${escapeHtml(link)}</a></p>`,
		`<p>${escapeHtml(after)}</p>`,
		'<p>— Dartelier</p>'
	].join('\n');
	return { to, subject, text, html };
}

export function invitationMail(input: {
	to: string;
	studioName: string;
	inviterName: string;
	role: Role;
	link: string;
}): Mail {
	return linkMail(
		input.to,
		`Join ${input.studioName} on Dartelier`,
		[
			`${input.inviterName} invites you to the studio "${input.studioName}" on Dartelier as ${roleLabel(input.role)}.`,
			'Open this link to create your account or, if you already have one, to join the studio:'
		],
		input.link,
		'The link works once and expires in 7 days. If you did not expect it, ignore this message.'
	);
}

export function passwordResetMail(input: { to: string; link: string }): Mail {
	return linkMail(
		input.to,
		'Set a new Dartelier password',
		['Someone (we hope you) asked to set a new password for this address on Dartelier.', 'Open this link to choose it:'],
		input.link,
		'The link works once and expires in 1 hour. Setting a new password signs you out everywhere else. If you did not ask, ignore this message.'
	);
}
