// The local S3-compatible fake (s3rver) inside the test runner's main process, for the integration
// and browser projects' global set-ups: loopback, a free port, the bucket created, its objects under
// .run/s3/<name> (emptied at each start). Stopped by the set-up's teardown.
import { rmSync } from 'node:fs';
import path from 'node:path';
import S3rver from 's3rver';

export interface S3Fake {
	endpoint: string;
	bucket: string;
	close(): Promise<void>;
}

export async function s3FakeStart(name: string, bucket = 'dartelier-photos'): Promise<S3Fake> {
	const directory = path.resolve('.run/s3', name);
	rmSync(directory, { recursive: true, force: true });
	const server = new S3rver({
		address: '127.0.0.1',
		port: Number(process.env.DARTELIER_TEST_S3_PORT ?? 0),
		directory,
		silent: true,
		vhostBuckets: false,
		configureBuckets: [{ name: bucket, configs: [] }]
	});
	const { port } = await server.run();
	return { endpoint: `http://127.0.0.1:${port}`, bucket, close: () => server.close() };
}
