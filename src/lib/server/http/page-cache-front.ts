import type { IncomingMessage, ServerResponse } from 'node:http';
import { earlyAnswer } from './page-cache';

/**
 * The page cache's hits answered in front of SvelteKit. Most of the shop's traffic is stored
 * public pages, and a hit through SvelteKit still built a Request, a Response, the request event
 * and ran the handle chain (about half the time a hit took, by `node --cpu-prof`). The built
 * server (scripts/adapter/cluster.js) calls the function registered here for every request
 * before adapter-node's handler; it writes a stored page and says true, or says false and the
 * request goes on to SvelteKit as before. Registered on `globalThis` because the built server and
 * the app's bundle share nothing else; under `vite dev` nothing calls it.
 */
export const FRONT_KEY = Symbol.for('chipstall.pageCacheFront');

export type Front = (req: IncomingMessage, res: ServerResponse) => boolean;

export function answerFromFront(req: IncomingMessage, res: ServerResponse): boolean {
	const h = req.headers;
	const found = earlyAnswer(req.method, req.url, (name) => {
		const v = h[name];
		return Array.isArray(v) ? v.join(', ') : v;
	});
	if (!found) return false;
	res.writeHead(found.status, found.headers);
	res.end(found.body ?? undefined);
	return true;
}

export function installPageCacheFront() {
	(globalThis as Record<symbol, Front>)[FRONT_KEY] = answerFromFront;
}
