import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	compilerOptions: { runes: true },
	kit: {
		// The test command builds into its own folders so it never overwrites `build/` under a running app.
		adapter: adapter({ out: process.env.CHIPSTALL_BUILD_DIR || 'build' }),
		outDir: process.env.CHIPSTALL_KIT_DIR || '.svelte-kit',
		csrf: { trustedOrigins: [] },
		typescript: {
			// Type-check (and type-aware lint) the scripts, stand-ins and root config files too.
			config: (tsconfig) => {
				tsconfig.include.push('../scripts/**/*.ts', '../mocks/**/*.ts', '../*.config.ts');
				return tsconfig;
			}
		}
	}
};

export default config;
