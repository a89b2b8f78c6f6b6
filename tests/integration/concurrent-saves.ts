// Many pattern cutters saving at once (the crash tests): each loop keeps one save in flight, again and
// again, until stopped. Version loops read a piece's head and save the next pivot on it (pivot-save.ts;
// two loops share each piece, so one of them is often refused 409); change loops save a carry across
// two panels as a style change (change-fixtures.ts; the bases stay heads, so each carry is stored anew).
// Every answer is recorded: what was acknowledged with 201 must be found stored afterwards.
import type { Piece } from '../../src/lib/pattern/piece-schema';
import { carryBody, type PanelStyle } from './change-fixtures';
import type { Client } from './helpers';
import { pivotSaveBody } from './pivot-save';

/** One save's answer: its status (`failed` when no answer came: the app was gone) and what a 201 stored. */
export interface SaveAnswer {
	kind: 'version' | 'change';
	status: number | 'failed';
	/** the stored versions a 201 named (the new version; a change's new pieces' versions) */
	versionIds: string[];
	changeId?: string;
}

export interface SaveTargets {
	studioId: string;
	/** pieces whose versions are saved (drafted front bodice blocks) */
	pieceIds: string[];
	/** two-panel styles whose carry is saved as a style change */
	panelStyles: PanelStyle[];
}

export interface SavesRunning {
	answers: SaveAnswer[];
	/** how many saves were answered 201 so far */
	acknowledged(): number;
	/** ends every loop after the request it has in flight; resolves when all have ended */
	stop(): Promise<void>;
}

/** No request of these tests may hang: one without an answer after this long counts as failed. */
const REQUEST_LIMIT_MS = 60_000;
const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** What these tests read from the API's answers. */
interface AnswerBody {
	shown?: { id: string; geometry: Piece };
	version?: { id: string };
	change?: { id: string };
	pieces?: { versions: { id: string }[] }[];
}

async function call(c: Client, method: string, path: string, json?: unknown) {
	const signal = AbortSignal.timeout(REQUEST_LIMIT_MS);
	const r = await c.request(method, path, json === undefined ? { headers: { accept: 'application/json' }, signal } : { json, signal });
	return { status: r.status, body: (await r.json().catch(() => ({}))) as AnswerBody };
}

/**
 * Starts `versionLoops` version loops (spread over the pieces, two or more to a piece) and
 * `changeLoops` change loops (spread over the panel styles), all at once, with one client's session.
 */
export function savesStart(c: Client, t: SaveTargets, versionLoops: number, changeLoops: number): SavesRunning {
	const answers: SaveAnswer[] = [];
	let running = true;
	const failed = async (kind: SaveAnswer['kind']) => {
		answers.push({ kind, status: 'failed', versionIds: [] });
		await pause(200);
	};
	const versionLoop = async (pieceId: string) => {
		while (running) {
			try {
				const read = await call(c, 'GET', `/api/studios/${t.studioId}/pieces/${pieceId}`);
				if (read.status !== 200) {
					await pause(200); // the database is away (503): try again shortly
					continue;
				}
				const r = await call(c, 'POST', `/api/studios/${t.studioId}/pieces/${pieceId}/versions`, pivotSaveBody(read.body.shown!));
				answers.push({ kind: 'version', status: r.status, versionIds: r.status === 201 ? [r.body.version!.id] : [] });
				if (r.status === 503) await pause(200);
			} catch {
				await failed('version');
			}
		}
	};
	const changeLoop = async (st: PanelStyle) => {
		const body = carryBody(st);
		while (running) {
			try {
				const r = await call(c, 'POST', `/api/studios/${t.studioId}/styles/${st.styleId}/changes`, body);
				answers.push({
					kind: 'change',
					status: r.status,
					versionIds: r.status === 201 ? (r.body.pieces ?? []).flatMap((p) => p.versions.map((v) => v.id)) : [],
					changeId: r.status === 201 ? r.body.change!.id : undefined
				});
				if (r.status === 503) await pause(200);
			} catch {
				await failed('change');
			}
		}
	};
	const loops = [
		...Array.from({ length: versionLoops }, (_, i) => versionLoop(t.pieceIds[i % t.pieceIds.length])),
		...Array.from({ length: changeLoops }, (_, i) => changeLoop(t.panelStyles[i % t.panelStyles.length]))
	];
	return {
		answers,
		acknowledged: () => answers.filter((a) => a.status === 201).length,
		async stop() {
			running = false;
			await Promise.all(loops);
		}
	};
}
