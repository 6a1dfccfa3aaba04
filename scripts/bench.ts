/**
 * `npm run bench`: builds and starts the product with its services (own database and ports),
 * then prints and writes to bench/results.json: the layout engine's timings, HTTP load figures
 * beside a bare node:http server serving the same bytes as /shop, database queries per request,
 * the shop's p99 under a pattern flood (slot, see bench/flood.ts), JavaScript and CSS per public
 * page from the build's manifest, and lab LCP from Lighthouse. Prints; never fails on a target.
 *
 * `BENCH_ONLY=load` (the HTTP load and its ratios) or `BENCH_ONLY=lcp` (Lighthouse alone) runs one
 * part and writes bench/results-<part>.json instead, leaving the full run's results.json alone.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import path from 'node:path';
import mysql from 'mysql2/promise';
import { config } from '../config/settings';
import { bringDown, bringUp } from './lib/bootstrap';
import { BIN, DATA_DIR, ROOT } from './lib/paths';
import { freePort, portAnswers, run, spawnTracked, stopAll, type Started } from './lib/services';
import { pageWeights } from './bench/bundles';
import { signInCookie } from './lib/sign-in';
import { engineTimings } from './bench/engine';
import { shopP99UnderPatternFlood } from './bench/flood';
import { basketCookie, uniqueAddressFlood, versionCheckAt } from './bench/cache';
import { formatLab, labLcp } from './bench/lighthouse';
import {
	CONNECTIONS,
	DURATION_S,
	formatLoad,
	measure,
	WARM_S,
	startBareServer,
	type LoadFigure
} from './bench/load';
import { DEMO_ACCOUNTS } from './seed/demo';

const e = process.env;
const work = path.join(DATA_DIR, 'bench');
mkdirSync(work, { recursive: true });
const appPort = await freePort(3200);
const s3Port = await freePort(4769);
Object.assign(e, {
	DB_NAME: e.BENCH_DB_NAME || 'chipstall_bench',
	SMTP_PORT: String(await freePort(2725)),
	MAIL_INBOX_PORT: String(await freePort(8225)),
	S3_PORT: String(s3Port),
	S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
	S3_DIR: path.join(work, 's3'),
	STRIPE_API_PORT: String(await freePort(12311)),
	PORT: String(appPort),
	ORIGIN: `http://localhost:${appPort}`,
	CHIPSTALL_BUILD_DIR: path.join(work, 'app'),
	CHIPSTALL_KIT_DIR: path.join(work, 'kit')
});
const base = e.ORIGIN!;
const PIECE = '/shop/rosette-bottle-holder';
/** App processes for the second load run: BENCH_PROCESSES, else one per core. */
const PROCESSES = Math.max(2, Number(e.BENCH_PROCESSES) || availableParallelism());
const PATTERN = '/api/pattern?diameter=70&count=3&width=100&length=300&initials=HMW&wood=cherry';
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const out: string[] = [];
const ONLY = e.BENCH_ONLY?.trim() || '';
if (ONLY && ONLY !== 'load' && ONLY !== 'lcp') {
	console.error(`BENCH_ONLY is 'load' or 'lcp', not '${ONLY}'.`);
	process.exit(1);
}
const say = (s = '') => {
	out.push(s);
	console.log(s);
};

/** Statements MariaDB received per request, averaged over `n` sequential requests. */
async function queriesPerRequest(url: string, n = 50, headers: Record<string, string> = {}) {
	const conn = await mysql.createConnection(config.db.url);
	const questions = async () => {
		const [rows] = (await conn.query("SHOW GLOBAL STATUS LIKE 'Questions'")) as unknown as [
			{ Value: string }[]
		];
		return Number(rows[0].Value);
	};
	try {
		await fetch(url, { headers }); // warm
		const before = await questions();
		for (let i = 0; i < n; i++) await (await fetch(url, { headers })).arrayBuffer();
		// Minus the two SHOW statements of our own.
		return Math.max(0, (await questions()) - before - 1) / n;
	} finally {
		await conn.end();
	}
}

/** Writes one part's figures (BENCH_ONLY) beside the full run's results.json. */
function writePart(part: string, figures: Record<string, unknown>) {
	mkdirSync(path.join(ROOT, 'bench'), { recursive: true });
	const file = path.join(ROOT, 'bench', `results-${part}.json`);
	const all = {
		at: new Date().toISOString(),
		connections: CONNECTIONS,
		durationS: DURATION_S,
		warmS: WARM_S,
		...figures
	};
	writeFileSync(file, JSON.stringify(all, null, 2) + '\n');
	say(`Written to ${path.relative(ROOT, file)}`);
}
/** Thrown to leave the run early once a BENCH_ONLY part is written. */
class Done extends Error {}
const DONE = new Done('part written');

/** Lab LCP for /shop and the piece page, both presets, after their photos were fetched once. */
async function lighthouseStep() {
	say(
		'\n== Lab LCP (Lighthouse 12.2.3, Debian Chromium, simulated throttling; target < 1.0 s)\n' +
			'   mobile: 412×823 DPR 1.75, CPU 4× slower, 150 ms RTT, 1.6 Mbit/s · desktop: 1350×940, 40 ms RTT, 10 Mbit/s'
	);
	// As after any first visitor: the page and its photos are in the process's caches.
	for (const p of ['/shop', PIECE]) {
		const html: string = await (await fetch(`${base}${p}`)).text();
		for (const photo of html.match(/\/photos\/[^\s",]+\.webp/g) ?? [])
			await (await fetch(`${base}${photo}`)).arrayBuffer();
	}
	const LH_RUNS = Number(e.BENCH_LIGHTHOUSE_RUNS || 3);
	const lcp = {
		shop: labLcp(`${base}/shop`, work, 'mobile', LH_RUNS),
		piece: labLcp(`${base}${PIECE}`, work, 'mobile', LH_RUNS),
		shopDesktop: labLcp(`${base}/shop`, work, 'desktop', LH_RUNS),
		pieceDesktop: labLcp(`${base}${PIECE}`, work, 'desktop', LH_RUNS)
	};
	for (const [k, v] of Object.entries(lcp))
		formatLab(k.replace('Desktop', ''), v).forEach((l) => say(l));
	return lcp;
}

const running = await bringUp();
const app: Started[] = [];
let exitCode = 0;
try {
	say('Building the app for the bench…');
	if ((await run(BIN('vite'), ['build', '--logLevel', 'warn'], e)) !== 0)
		throw new Error('build failed');

	// Skipped when one part runs alone (BENCH_ONLY).
	const engine = ONLY ? { lines: [], figures: null } : await engineTimings();
	if (!ONLY) say('\n== Layout engine (in this process)');
	engine.lines.forEach((l) => say(l));

	/** Starts the built app with `processes` workers (WEB_CONCURRENCY, see scripts/adapter/cluster.js). */
	const startApp = async (processes: number) => {
		// Let requests still running from the last load finish before their process stops.
		if (app.length) await sleep(1500);
		await stopAll(app.splice(0));
		app.push(
			spawnTracked('bench-app', process.execPath, [e.CHIPSTALL_BUILD_DIR!], {
				env: { ...e, WEB_CONCURRENCY: String(processes) },
				ports: [appPort],
				quiet: true
			})
		);
		for (let i = 0; i < 200 && !(await portAnswers(appPort)); i++) await sleep(100);
		// Every worker answers before the clock starts (the port opens with the first).
		for (let i = 0; i < processes * 100; i++)
			for (const p of ['/shop', PIECE]) await (await fetch(`${base}${p}`)).arrayBuffer();
	};
	await startApp(1);
	if (ONLY === 'lcp') {
		writePart('lcp', { lcp: await lighthouseStep() });
		throw DONE;
	}
	const owner = DEMO_ACCOUNTS.find((a) => a.role === 'owner')!;
	const cookie = await signInCookie(base, owner.email, owner.password);
	const shopRes = await fetch(`${base}/shop`);
	const shopBody = Buffer.from(await shopRes.arrayBuffer());
	const bare = await startBareServer(
		shopBody,
		shopRes.headers.get('content-type') ?? 'text/html',
		work
	);

	say(
		`\n== HTTP load: autocannon, ${CONNECTIONS} connections, ${DURATION_S} s each, one app process`
	);
	const load: LoadFigure[] = [];
	try {
		load.push(await measure('bare node:http (same bytes as /shop)', bare.url));
	} finally {
		await bare.stop();
	}
	load.push(await measure('/shop', `${base}/shop`));
	load.push(await measure(`${PIECE}`, `${base}${PIECE}`));
	load.push(await measure('/api/pattern (3 rosettes, initials)', `${base}${PATTERN}`));
	load.push(
		await measure('/api/workshop/orders (signed in)', `${base}/api/workshop/orders`, { cookie })
	);
	// Compressed (brotli, as browsers ask) and with a basket cookie, against the same bare server.
	const br = { 'accept-encoding': 'gzip, deflate, br' };
	const basket = { cookie: await basketCookie(base, PIECE, 'basswood') };
	const shopper = {
		shopBr: await measure('/shop (brotli)', `${base}/shop`, br),
		pieceBr: await measure(`${PIECE} (brotli)`, `${base}${PIECE}`, br),
		basketShop: await measure('/shop with a basket', `${base}/shop`, basket),
		basketPiece: await measure(`${PIECE} with a basket`, `${base}${PIECE}`, basket),
		basketShopBr: await measure('/shop with a basket (brotli)', `${base}/shop`, {
			...basket,
			...br
		}),
		basketPieceBr: await measure(`${PIECE} with a basket (brotli)`, `${base}${PIECE}`, {
			...basket,
			...br
		})
	};
	load.forEach((f) => say(formatLoad(f)));
	Object.values(shopper).forEach((f) => say(formatLoad(f)));
	const ratio = (f: { reqPerSec: number }) => f.reqPerSec / load[0].reqPerSec;
	const ratios: Record<keyof typeof shopper | 'shop' | 'piece', number> = {
		shop: ratio(load[1]),
		piece: ratio(load[2]),
		...(Object.fromEntries(Object.entries(shopper).map(([k, f]) => [k, ratio(f)])) as Record<
			keyof typeof shopper,
			number
		>)
	};
	say(`shop/bare ratio: ${ratio(load[1]).toFixed(2)}`);
	say(`piece/bare ratio: ${ratio(load[2]).toFixed(2)}`);
	say(`shop/bare ratio (brotli): ${ratios.shopBr.toFixed(2)}`);
	say(`piece/bare ratio (brotli): ${ratios.pieceBr.toFixed(2)}`);
	say(`basket shop/bare ratio: ${ratios.basketShop.toFixed(2)}`);
	say(`basket piece/bare ratio: ${ratios.basketPiece.toFixed(2)}`);
	say(`basket shop/bare ratio (brotli): ${ratios.basketShopBr.toFixed(2)}`);
	say(`basket piece/bare ratio (brotli): ${ratios.basketPieceBr.toFixed(2)}`);
	say('targets: cached ≥ 0.5 of bare, with a basket ≥ 0.4 of bare');
	if (ONLY === 'load') {
		writePart('load', { load, shopper, ratios });
		throw DONE;
	}

	say('\n== Unique-address flood: 100 connections of never-seen query strings, 10 of visitors');
	// Renders still queued from the basket runs would otherwise land in this one's figures.
	await sleep(5000);
	const uniqueFlood = await uniqueAddressFlood(base, PIECE, DURATION_S);
	say(
		`visitors' /shop p99 ${uniqueFlood.cachedP99Ms} ms, p50 ${uniqueFlood.cachedP50Ms} ms, ${uniqueFlood.cachedReqPerSec} req/s; flood ${uniqueFlood.floodReqPerSec} req/s, non-2xx ${uniqueFlood.non2xx}, errors ${uniqueFlood.errors}, timeouts ${uniqueFlood.timeouts} (target p99 < 100 ms)`
	);

	say('\n== Catalogue version check (the query each process runs at most once a second)');
	const versionCheck = await versionCheckAt(config.db.url, 200_000);
	say(
		`${versionCheck.meanMs.toFixed(3)} ms mean at ${versionCheck.historyRows} order history rows (target < 1 ms)`
	);

	say(
		`\n== The same with ${PROCESSES} app processes (node:cluster, WEB_CONCURRENCY=${PROCESSES}); bare server still one process`
	);
	await startApp(PROCESSES);
	const clustered: LoadFigure[] = [
		await measure('/shop', `${base}/shop`),
		await measure(`${PIECE}`, `${base}${PIECE}`)
	];
	clustered.forEach((f) => say(formatLoad(f)));
	say(`shop/bare ratio (${PROCESSES} processes): ${ratio(clustered[0]).toFixed(2)}`);
	say(`piece/bare ratio (${PROCESSES} processes): ${ratio(clustered[1]).toFixed(2)}`);
	await startApp(1);

	say('\n== Database statements per request (MariaDB Questions counter, 50 sequential requests)');
	const queries = {
		shop: await queriesPerRequest(`${base}/shop`),
		piece: await queriesPerRequest(`${base}${PIECE}`),
		workshopOrders: await queriesPerRequest(`${base}/api/workshop/orders`, 50, { cookie })
	};
	say(
		`/shop ${queries.shop.toFixed(2)}   ${PIECE} ${queries.piece.toFixed(2)}   /api/workshop/orders ${queries.workshopOrders.toFixed(2)}`
	);

	say('\n== Shop p99 while /api/pattern is flooded');
	const flood = await shopP99UnderPatternFlood(base);
	say(
		flood.shopP99Ms === null
			? `not measured: ${flood.note}`
			: `shop p99 ${flood.shopP99Ms} ms (${flood.note})`
	);

	say('\n== JavaScript and CSS per public page (gzip, from the build manifest; target JS ≤ 50 KB)');
	const publicRoutes = [
		'/(shop)',
		'/(shop)/shop',
		'/(shop)/shop/[slug]',
		'/(shop)/cart',
		'/(shop)/checkout',
		'/(shop)/orders/[ref]',
		'/(auth)/signin'
	];
	const weights = pageWeights(
		e.CHIPSTALL_KIT_DIR!,
		path.join(e.CHIPSTALL_BUILD_DIR!, 'client'),
		publicRoutes
	);
	for (const w of weights) {
		say(
			`${w.route.padEnd(24)} JS ${(w.jsGzip / 1024).toFixed(1).padStart(6)} KB   CSS ${(w.cssGzip / 1024).toFixed(1).padStart(5)} KB${w.jsGzip > 50 * 1024 ? '   (over 50 KB)' : ''}`
		);
	}

	const lcp = await lighthouseStep();

	say(
		'\nFigures on a shared 2-core machine vary with whatever else runs; compare runs side by side.'
	);
	mkdirSync(path.join(ROOT, 'bench'), { recursive: true });
	writeFileSync(
		path.join(ROOT, 'bench', 'results.json'),
		JSON.stringify(
			{
				at: new Date().toISOString(),
				connections: CONNECTIONS,
				durationS: DURATION_S,
				warmS: WARM_S,
				appProcesses: 1,
				clustered: { processes: PROCESSES, load: clustered },
				shopBareRatioClustered: ratio(clustered[0]),
				pieceBareRatioClustered: ratio(clustered[1]),
				engine: engine.figures,
				load,
				shopBareRatio: ratio(load[1]),
				pieceBareRatio: ratio(load[2]),
				basketShopBareRatio: ratios.basketShop,
				shopper,
				ratios,
				uniqueFlood,
				versionCheck,
				queriesPerRequest: queries,
				flood,
				pageWeights: weights,
				lcp
			},
			null,
			2
		) + '\n'
	);
	say('Written to bench/results.json');
} catch (err) {
	if (err !== DONE) {
		console.error(err);
		exitCode = 1;
	}
} finally {
	await stopAll(app);
	await bringDown(running);
}
process.exit(exitCode);
