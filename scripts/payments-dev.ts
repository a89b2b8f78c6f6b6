// The local payments fake as its own process, for `npm start`:
//   npx tsx scripts/payments-dev.ts
// API (point the app's SDK at it) on http://127.0.0.1:${PAYMENTS_FAKE_PORT:-4176}, with the key
// STRIPE_SECRET_KEY (default sk_test_dartelier_local); webhooks signed with STRIPE_WEBHOOK_SECRET
// (default whsec_dartelier_local) posted to PAYMENTS_FAKE_WEBHOOK_URL
// (default http://127.0.0.1:4173/api/billing/webhook). The demo studio's subscription is there from the
// start (fixtures/demo-billing.json); everything else lives in memory until it stops.
import { PAYMENTS_FAKE_DEFAULT_PORT, PAYMENTS_FAKE_KEY, PAYMENTS_FAKE_WEBHOOK_SECRET, paymentsFakeStart } from './payments-fake/server';

const port = Number(process.env.PAYMENTS_FAKE_PORT ?? PAYMENTS_FAKE_DEFAULT_PORT);
const fake = await paymentsFakeStart({
	port,
	secretKey: process.env.STRIPE_SECRET_KEY ?? PAYMENTS_FAKE_KEY,
	webhookSecret: process.env.STRIPE_WEBHOOK_SECRET ?? PAYMENTS_FAKE_WEBHOOK_SECRET,
	webhookUrl: process.env.PAYMENTS_FAKE_WEBHOOK_URL ?? 'http://127.0.0.1:4173/api/billing/webhook',
	demo: process.env.PAYMENTS_FAKE_DEMO !== 'no',
	log: (line) => console.log(line)
});
console.log(`[payments-fake] provider API and checkout pages on ${fake.url}`);

function stop() {
	fake.close().then(() => process.exit(0));
	setTimeout(() => process.exit(0), 1000).unref();
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
