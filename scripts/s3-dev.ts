// Local S3-compatible object store for development and tests (s3rver, in this process).
//   npx tsx scripts/s3-dev.ts
// Listens on 127.0.0.1:${S3_DEV_PORT:-4175}, keeps its objects in ${S3_DEV_DIR:-.run/s3/dev}, creates
// the bucket ${S3_BUCKET:-dartelier-photos} when it starts, and prints "s3-dev ready" once it answers.
// Credentials are the fake's own (S3RVER / S3RVER); it checks request signatures and link expiry
// but no sizes or types: the app enforces those itself. Nothing leaves the machine.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import S3rver from 's3rver';

const PORT = Number(process.env.S3_DEV_PORT ?? 4175);
const DIR = path.resolve(process.cwd(), process.env.S3_DEV_DIR ?? '.run/s3/dev');
const BUCKET = process.env.S3_BUCKET ?? 'dartelier-photos';

mkdirSync(DIR, { recursive: true });
const server = new S3rver({
	address: '127.0.0.1',
	port: PORT,
	directory: DIR,
	silent: true,
	vhostBuckets: false,
	configureBuckets: [{ name: BUCKET, configs: [] }]
});
await server.run();
console.log(`s3-dev ready on http://127.0.0.1:${PORT}, bucket ${BUCKET}, data in ${path.relative(process.cwd(), DIR) || DIR}`);

const stop = () => {
	server.close().finally(() => process.exit(0));
};
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
