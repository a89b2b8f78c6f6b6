import { randomBytes } from 'node:crypto';
import {
	CreateBucketCommand,
	DeleteObjectsCommand,
	GetObjectCommand,
	HeadBucketCommand,
	HeadObjectCommand,
	ListObjectsV2Command,
	PutObjectCommand,
	S3Client
} from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';

/**
 * The one place that talks to the object store (photos of fittings). Everything comes from the
 * environment, read when used (so tests and scripts can point it elsewhere after start-up); nothing
 * else in the app knows which store it is:
 *   S3_ENDPOINT   default http://127.0.0.1:4175 (the local fake of scripts/s3-dev.ts)
 *   S3_REGION     default us-east-1
 *   S3_BUCKET     default dartelier-photos
 *   S3_ACCESS_KEY_ID / S3_SECRET_ACCESS_KEY   default the local fake's S3RVER / S3RVER
 *   S3_FORCE_PATH_STYLE   default true (bucket in the path, as local and most S3-compatible stores want)
 */
export interface StorageConfig {
	endpoint: string;
	region: string;
	bucket: string;
	accessKeyId: string;
	secretAccessKey: string;
	forcePathStyle: boolean;
}

export function storageConfig(env: NodeJS.ProcessEnv = process.env): StorageConfig {
	return {
		endpoint: env.S3_ENDPOINT || 'http://127.0.0.1:4175',
		region: env.S3_REGION || 'us-east-1',
		bucket: env.S3_BUCKET || 'dartelier-photos',
		accessKeyId: env.S3_ACCESS_KEY_ID || 'S3RVER',
		secretAccessKey: env.S3_SECRET_ACCESS_KEY || 'S3RVER',
		forcePathStyle: env.S3_FORCE_PATH_STYLE !== 'false'
	};
}

// The SDK warns once that releases after January 2027 will need Node 22. This project pins its version
// exactly (package-lock), so the warning says nothing a user of the app can act on.
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';

let cached: { key: string; client: S3Client } | undefined;

function client(config: StorageConfig): S3Client {
	const key = JSON.stringify(config);
	if (cached?.key !== key) {
		cached?.client.destroy();
		cached = {
			key,
			client: new S3Client({
				endpoint: config.endpoint,
				region: config.region,
				forcePathStyle: config.forcePathStyle,
				credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
				requestChecksumCalculation: 'WHEN_REQUIRED',
				responseChecksumValidation: 'WHEN_REQUIRED',
				maxAttempts: 2
			})
		};
	}
	return cached.client;
}

/** A new object key under a prefix: random, never derived from what the user sent. */
export function storageKeyNew(prefix: string): string {
	return `${prefix}/${randomBytes(16).toString('hex')}`;
}

export async function storagePut(key: string, body: Uint8Array, contentType: string): Promise<void> {
	const config = storageConfig();
	await client(config).send(
		new PutObjectCommand({ Bucket: config.bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.byteLength })
	);
}

/** The object's bytes, or null when there is none under this key. */
export async function storageGet(key: string): Promise<Uint8Array | null> {
	const config = storageConfig();
	try {
		const r = await client(config).send(new GetObjectCommand({ Bucket: config.bucket, Key: key }));
		return r.Body ? await r.Body.transformToByteArray() : new Uint8Array();
	} catch (e) {
		if (notFound(e)) return null;
		throw e;
	}
}

/** The object's bytes and type, or null when there is none under this key (backups). */
export async function storageGetWithType(key: string): Promise<{ bytes: Uint8Array; contentType: string } | null> {
	const config = storageConfig();
	try {
		const r = await client(config).send(new GetObjectCommand({ Bucket: config.bucket, Key: key }));
		const bytes = r.Body ? await r.Body.transformToByteArray() : new Uint8Array();
		return { bytes, contentType: r.ContentType ?? 'application/octet-stream' };
	} catch (e) {
		if (notFound(e)) return null;
		throw e;
	}
}

/** Every key in the bucket, in the store's order (backups). */
export async function storageList(): Promise<string[]> {
	const config = storageConfig();
	const keys: string[] = [];
	let token: string | undefined;
	do {
		const r = await client(config).send(new ListObjectsV2Command({ Bucket: config.bucket, ContinuationToken: token }));
		for (const o of r.Contents ?? []) if (o.Key) keys.push(o.Key);
		token = r.IsTruncated ? r.NextContinuationToken : undefined;
	} while (token);
	return keys;
}

/** Resolves when the store answers for the bucket (readiness); rejects otherwise. */
export async function storageReachable(abortSignal?: AbortSignal): Promise<void> {
	const config = storageConfig();
	await client(config).send(new HeadBucketCommand({ Bucket: config.bucket }), { abortSignal });
}

/** Creates the bucket when the store has none of that name (a restore into a new store). */
export async function storageBucketEnsure(): Promise<void> {
	const config = storageConfig();
	try {
		await client(config).send(new HeadBucketCommand({ Bucket: config.bucket }));
	} catch (e) {
		if (!notFound(e)) throw e;
		await client(config).send(new CreateBucketCommand({ Bucket: config.bucket }));
	}
}

export async function storageExists(key: string): Promise<boolean> {
	const config = storageConfig();
	try {
		await client(config).send(new HeadObjectCommand({ Bucket: config.bucket, Key: key }));
		return true;
	} catch (e) {
		if (notFound(e)) return false;
		throw e;
	}
}

/** Removes the objects (keys that hold nothing are fine). */
export async function storageDelete(keys: readonly string[]): Promise<void> {
	const config = storageConfig();
	for (let i = 0; i < keys.length; i += 1000) {
		const batch = keys.slice(i, i + 1000);
		await client(config).send(
			new DeleteObjectsCommand({ Bucket: config.bucket, Delete: { Objects: batch.map((Key) => ({ Key })), Quiet: true } })
		);
	}
}

/** How long a link to a photo works. */
export const STORAGE_LINK_SECONDS = 15 * 60;

/** A short-lived link that lets a browser GET the object directly from the store. */
export async function storageSignedGetUrl(key: string, expiresInSeconds = STORAGE_LINK_SECONDS, signingDate?: Date): Promise<string> {
	const config = storageConfig();
	return getSignedUrl(client(config), new GetObjectCommand({ Bucket: config.bucket, Key: key }), {
		expiresIn: expiresInSeconds,
		...(signingDate ? { signingDate } : {})
	});
}

/** The origin pages load photos from (for the Content-Security-Policy's img-src). */
export function storageOrigin(): string | null {
	try {
		return new URL(storageConfig().endpoint).origin;
	} catch {
		return null;
	}
}

function notFound(e: unknown): boolean {
	const err = e as { name?: string; $metadata?: { httpStatusCode?: number } };
	return err?.name === 'NoSuchKey' || err?.name === 'NotFound' || err?.$metadata?.httpStatusCode === 404;
}
