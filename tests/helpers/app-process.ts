/**
 * Extra copies of the built app for the tests that need more than the one Playwright starts:
 * several processes against one MariaDB, or an app on a database the test stops and starts.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import path from 'node:path';

export type AppProcess = { url: string; port: number; child: ChildProcess; stop(): Promise<void> };

export function freePort(): Promise<number> {
	return new Promise((resolve, reject) => {
		const srv = createServer();
		srv.once('error', reject);
		srv.listen(0, '127.0.0.1', () => {
			const { port } = srv.address() as { port: number };
			srv.close(() => resolve(port));
		});
	});
}

/** Starts `node <build>` on a free port with `env` on top of this process's; waits until it answers. */
export async function startApp(env: Record<string, string> = {}): Promise<AppProcess> {
	const port = await freePort();
	const url = `http://localhost:${port}`;
	const build = path.resolve(process.env.CHIPSTALL_BUILD_DIR || 'build');
	const child = spawn(process.execPath, [build], {
		env: { ...process.env, ...env, PORT: String(port), ORIGIN: url },
		stdio: ['ignore', 'ignore', 'pipe']
	});
	let stderr = '';
	child.stderr.on('data', (c: Buffer) => (stderr = (stderr + c.toString()).slice(-4000)));
	const stop = async () => {
		if (child.exitCode !== null || child.signalCode !== null) return;
		const exited = new Promise<void>((r) => child.once('exit', () => r()));
		child.kill('SIGTERM');
		const t = setTimeout(() => child.kill('SIGKILL'), 5000);
		await exited;
		clearTimeout(t);
	};
	const deadline = Date.now() + 30_000;
	while (Date.now() < deadline) {
		if (child.exitCode !== null) throw new Error(`app exited early:\n${stderr}`);
		try {
			await fetch(`${url}/care`);
			return { url, port, child, stop };
		} catch {
			await new Promise((r) => setTimeout(r, 150));
		}
	}
	await stop();
	throw new Error(`app did not answer on ${port}:\n${stderr}`);
}

export { signInCookie } from '../../scripts/lib/sign-in';
