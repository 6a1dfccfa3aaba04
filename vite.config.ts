import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	test: {
		include: ['tests/unit/**/*.test.ts'],
		setupFiles: ['tests/unit/helpers/test-database.ts'],
		environment: 'node',
		testTimeout: 20000,
		hookTimeout: 60000,
		fileParallelism: false
	}
});
