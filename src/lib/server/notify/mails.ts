import type { Mail } from '../mail/send';

/** The e-mails of the review and of fit notes; each links to the exact page. */
function mail(to: string, subject: string, lines: string[], link: string): Mail {
	const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
	const after = 'You receive this because of your part in the studio; turn this kind of e-mail off in your settings.';
	const text = [...lines, '', link, '', after, '', '— Dartelier'].join('\n');
	const html = [...lines.map((l) => `<p>${esc(l)}</p>`), `<p><a href="${esc(link)}">${esc(link)}</a></p>`, `<p>${esc(after)}</p>`, '<p>— Dartelier</p>'].join('\n');
	return { to, subject, text, html };
}

export interface VersionRef {
	styleName: string;
	pieceName: string;
	number: number;
	link: string;
}

export function versionProposedMail(to: string, v: VersionRef & { proposerName: string; message: string }): Mail {
	return mail(
		to,
		`Review: ${v.pieceName} version ${v.number} of ${v.styleName}`,
		[`${v.proposerName} proposes ${v.pieceName} version ${v.number} of ${v.styleName} for sign-off.`, `“${v.message}”`, 'Review it, then sign it off or send it back:'],
		v.link
	);
}

export function versionReviewedMail(
	to: string,
	v: VersionRef & { reviewerName: string; outcome: 'signed_off' | 'sent_back'; comment: string }
): Mail {
	const what = v.outcome === 'signed_off' ? 'signed off' : 'sent back';
	const lines = [`${v.reviewerName} ${what} ${v.pieceName} version ${v.number} of ${v.styleName}.`];
	if (v.comment) lines.push(`${v.outcome === 'sent_back' ? 'Reason' : 'Comment'}: ${v.comment}`);
	return mail(to, `${v.pieceName} version ${v.number} ${what}`, [...lines, 'The version:'], v.link);
}

export function fitNoteAssignedMail(
	to: string,
	n: { styleName: string; pieceName: string; fittingTitle: string; category: string; body: string; byName: string; link: string }
): Mail {
	return mail(
		to,
		`Fit note on ${n.pieceName}: ${n.category}`,
		[`${n.byName} gives you a fit note from "${n.fittingTitle}" (${n.styleName}), on ${n.pieceName}:`, `${n.category}: ${n.body}`, 'The note on the pattern:'],
		n.link
	);
}
