import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	test: {
		// tests/unit: pure; tests/db: against MariaDB. Both only ever reach a test database:
		// the setup file refuses any other before a test file loads.
		include: ['tests/unit/**/*.test.ts', 'tests/db/**/*.test.ts'],
		setupFiles: ['tests/helpers/test-database.ts'],
		environment: 'node',
		testTimeout: 20000,
		hookTimeout: 60000,
		fileParallelism: false
	}
});
