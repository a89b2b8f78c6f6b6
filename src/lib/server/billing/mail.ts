import { mailSend } from '../mail/send';

/** The e-mail to a studio's owner when the provider could not take a payment. */
export async function paymentFailedMailSend(input: {
	to: string;
	studioName: string;
	amountMinor: number;
	currency: string;
	billingLink: string;
	invoiceLink: string | null;
}): Promise<void> {
	const amount = new Intl.NumberFormat('en-GB', { style: 'currency', currency: input.currency.toUpperCase() }).format(input.amountMinor / 100);
	const lines = [
		`The payment of ${amount} for the studio "${input.studioName}" on Dartelier did not go through.`,
		'The payment provider will try again. Until it is paid the studio keeps its seats; update the card on the Billing page:',
		'',
		input.billingLink,
		...(input.invoiceLink ? ['', `The invoice: ${input.invoiceLink}`] : []),
		'',
		'Nothing in the studio is hidden or deleted if the plan lapses: only new work past the free plan\'s limits is paused.',
		'',
		'— Dartelier'
	];
	await mailSend({ to: input.to, subject: `Payment failed for ${input.studioName}`, text: lines.join('\n') });
}
