import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';
import { clustered } from './scripts/adapter/cluster.js';

const out = process.env.CHIPSTALL_BUILD_DIR || 'build';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	compilerOptions: { runes: true },
	kit: {
		// The test command builds into its own folders so it never overwrites `build/` under a running app.
		// `node build` runs WEB_CONCURRENCY processes (scripts/adapter/cluster.js).
		adapter: clustered(adapter({ out }), out),
		outDir: process.env.CHIPSTALL_KIT_DIR || '.svelte-kit',
		// The cross-site form check is made in src/lib/server/http/address.ts, just as strictly
		// (form content types, Origin must equal ORIGIN), so a refusal can say why and link to the
		// shop's own address. '*' is how this SvelteKit turns its own (bare text) check off.
		csrf: { trustedOrigins: ['*'] },
		// Content-Security-Policy on every page (OWASP Content Security Policy Cheat Sheet):
		// SvelteKit names its own inline script by its sha256 hash in the policy, so no
		// 'unsafe-inline' for scripts. Styles keep it for the style attributes the preview and
		// planner drawings set. Non-page responses get a deny-all policy in hooks.server.ts.
		csp: {
			// Hashes rather than nonces: a cached public page is answered with the same bytes and the same
			// policy every time (a nonce must never repeat), see src/lib/server/http/page-cache.ts.
			mode: 'hash',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self', 'unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self'],
				'connect-src': ['self'],
				'worker-src': ['self', 'blob:'],
				'object-src': ['none'],
				'base-uri': ['self'],
				'frame-ancestors': ['none']
			}
		},
		typescript: {
			// Type-check (and type-aware lint) the scripts, stand-ins, settings and root config files too.
			config: (tsconfig) => {
				tsconfig.include.push(
					'../scripts/**/*.ts',
					'../mocks/**/*.ts',
					'../config/**/*.ts',
					'../*.config.ts'
				);
				return tsconfig;
			}
		}
	}
};

export default config;
