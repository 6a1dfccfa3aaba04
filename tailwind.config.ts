import type { Config } from 'tailwindcss';

export default {
	content: ['./src/**/*.{html,js,svelte,ts}'],
	theme: {
		extend: {
			colors: {
				paper: { DEFAULT: 'var(--c-paper)', deep: 'var(--c-paper-deep)' },
				card: 'var(--c-card)',
				ink: { DEFAULT: 'var(--c-ink)', soft: 'var(--c-ink-soft)' },
				line: 'var(--c-line)',
				accent: { DEFAULT: 'var(--c-accent)', deep: 'var(--c-accent-deep)' },
				moss: { DEFAULT: 'var(--c-moss)', deep: 'var(--c-moss-deep)' },
				warn: 'var(--c-warn)',
				danger: 'var(--c-danger)',
				focus: 'var(--c-focus)'
			},
			borderRadius: { wood: 'var(--radius)' },
			fontFamily: { sans: ['Nunito', 'ui-sans-serif', 'system-ui', 'sans-serif'] }
		}
	}
} satisfies Config;
