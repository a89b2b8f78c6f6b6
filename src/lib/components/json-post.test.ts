import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonPost } from './json-post';

const answer = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });

afterEach(() => {
	vi.unstubAllGlobals();
});

describe('jsonPost', () => {
	it('posts the payload as JSON and hands the answer to done on success, returning no message', async () => {
		const fetchMock = vi.fn(async () => answer(200, { signed: ['a'] }));
		vi.stubGlobal('fetch', fetchMock);
		const seen: unknown[] = [];
		expect(await jsonPost<{ signed: string[] }>('/api/x', { sizes: 'all' }, (b) => void seen.push(b))).toBeNull();
		expect(seen).toEqual([{ signed: ['a'] }]);
		expect(fetchMock).toHaveBeenCalledWith('/api/x', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"sizes":"all"}' });
	});

	it('returns the API error message of a refusal, else a general one, without calling done', async () => {
		const done = vi.fn();
		vi.stubGlobal('fetch', async () => answer(409, { error: { code: 'stale', message: 'Already signed off.' } }));
		expect(await jsonPost('/api/x', {}, done)).toBe('Already signed off.');
		vi.stubGlobal('fetch', async () => answer(500, {}));
		expect(await jsonPost('/api/x', {}, done)).toBe('That did not work.');
		expect(done).not.toHaveBeenCalled();
	});

	it('says the server could not be reached when the request fails or done throws', async () => {
		vi.stubGlobal('fetch', async () => {
			throw new TypeError('fetch failed');
		});
		expect(await jsonPost('/api/x', {}, () => {})).toBe('The server could not be reached; nothing changed.');
		vi.stubGlobal('fetch', async () => answer(200, {}));
		expect(
			await jsonPost('/api/x', {}, async () => {
				throw new Error('reload failed');
			})
		).toBe('The server could not be reached; nothing changed.');
	});
});
