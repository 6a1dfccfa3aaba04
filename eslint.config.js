import js from '@eslint/js';
import prettier from 'eslint-config-prettier';
import svelte from 'eslint-plugin-svelte';
import globals from 'globals';
import ts from 'typescript-eslint';
import svelteConfig from './svelte.config.js';

export default ts.config(
	{
		// Generated, installed or scratch folders: nothing here is written by hand.
		ignores: [
			'build/',
			'.svelte-kit/',
			'.data/',
			'node_modules/',
			'drizzle/',
			'test-results/',
			'playwright-report/',
			'tmp/',
			'.tmp*/'
		]
	},
	js.configs.recommended,
	...ts.configs.recommendedTypeChecked,
	...svelte.configs.recommended,
	prettier,
	...svelte.configs.prettier,
	{
		languageOptions: {
			globals: { ...globals.browser, ...globals.node },
			parserOptions: {
				// Type-aware rules (floating promises) need the project's types, .svelte files included.
				// The service worker has its own libs (webworker), so SvelteKit's tsconfig leaves it out.
				projectService: { allowDefaultProject: ['src/service-worker.ts'] },
				extraFileExtensions: ['.svelte'],
				tsconfigRootDir: import.meta.dirname
			}
		},
		rules: {
			'@typescript-eslint/no-floating-promises': 'error',
			'@typescript-eslint/no-unused-vars': [
				'error',
				{ argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }
			],
			// TypeScript already reports undefined names, and this rule does not know about type-only globals.
			'no-undef': 'off',
			// The app is served from the site root (no paths.base), so plain hrefs are already right.
			'svelte/no-navigation-without-resolve': 'off'
		}
	},
	{
		files: ['**/*.svelte', '**/*.svelte.ts', '**/*.svelte.js'],
		languageOptions: {
			parserOptions: {
				parser: ts.parser,
				svelteConfig
			}
		}
	},
	{
		// Plain JS config files sit outside tsconfig's reach; lint them without type information.
		files: ['**/*.js', '**/*.mjs', '**/*.cjs'],
		...ts.configs.disableTypeChecked
	}
);
