import type { Config } from 'tailwindcss';

/** Dartelier's palette and type, defined once. */
export default {
	content: ['./src/**/*.{html,svelte,ts}'],
	theme: {
		extend: {
			colors: {
				paper: '#F7F3EA',
				ink: '#1F2A37',
				chalk: '#E4DED0',
				indigo: { DEFAULT: '#2F4B7C', dark: '#223a61' },
				madder: '#B5452F',
				sage: '#5E7D63',
				ochre: '#C08A2E'
			},
			fontFamily: {
				sans: ['"Source Sans 3"', 'system-ui', 'sans-serif']
			}
		}
	}
} satisfies Config;
