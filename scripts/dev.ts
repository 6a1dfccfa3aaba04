/**
 * `npm run dev`: the same services as `npm start`, then `vite dev` with hot reload
 * (PORT, default 5173). Ctrl-C stops what this run started.
 */
import { config } from '../config/settings';
import { banner, bringDown, bringUp, stopOnSignals } from './lib/bootstrap';
import { BIN } from './lib/paths';
import { spawnTracked } from './lib/services';

const port = Number(process.env.PORT || 5173);
process.env.PORT = String(port);
process.env.ORIGIN ??= `http://localhost:${port}`;

const running = await bringUp().catch((err) => {
	console.error(err instanceof Error ? err.message : err);
	process.exit(1);
});
stopOnSignals(running);

// node_modules/.bin/vite directly: killing `npx vite` would leave its child running.
const vite = spawnTracked('vite', BIN('vite'), ['dev', '--port', String(port), '--strictPort'], {
	ports: [port]
});
running.children.push(vite);
vite.child.once('exit', (code) => {
	if (running.stopping) return;
	running.children = [];
	void bringDown(running).finally(() => process.exit(code ?? 1));
});
await banner(config.origin);
