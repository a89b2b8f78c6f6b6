// Serves the built app (adapter-node's handler.js) with node:http inside a worker thread of the
// test process: plain Node loads the build, not Vitest's module runner (which would re-compile the
// built chunks). Started by app-server.ts; reports its port, stops on 'close'.
import http from 'node:http';
import { pathToFileURL } from 'node:url';
import { parentPort, workerData } from 'node:worker_threads';

/** @type {((req: any, res: any, next: () => void) => void) | undefined} */
let handler;
const server = http.createServer((req, res) => {
	if (!handler) {
		res.statusCode = 503;
		res.end('starting');
		return;
	}
	handler(req, res, () => {
		res.statusCode = 404;
		res.end('Not Found');
	});
});
await new Promise((resolve) => server.listen(0, '127.0.0.1', () => resolve(undefined)));
const address = /** @type {import('node:net').AddressInfo} */ (server.address());
// adapter-node reads ORIGIN when it is imported; without it, it would assume https.
process.env.ORIGIN = `http://127.0.0.1:${address.port}`;
({ handler } = await import(pathToFileURL(workerData.handlerFile).href));
parentPort?.postMessage({ port: address.port });
parentPort?.on('message', (m) => {
	if (m === 'close') {
		server.closeAllConnections();
		server.close(() => parentPort?.postMessage('closed'));
	}
});
