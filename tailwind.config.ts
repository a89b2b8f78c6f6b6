import type { Config } from 'tailwindcss';

/**
 * Dartelier's palette and type, defined once. Every colour used for text reads at 4.5:1 or more
 * (WCAG 2.2 AA, checked by axe in the browser tests) on paper, on white and on its own 10 % tint;
 * greyed text is `ink-soft`, never ink made transparent (ink at 60 % falls to 3.9:1 on paper).
 */
export default {
	content: ['./src/**/*.{html,svelte,ts}'],
	theme: {
		extend: {
			colors: {
				paper: '#F7F3EA',
				ink: { DEFAULT: '#1F2A37', soft: '#4D5663' },
				chalk: '#E4DED0',
				indigo: { DEFAULT: '#2F4B7C', dark: '#223a61' },
				madder: '#A63D28',
				sage: '#476350',
				ochre: '#7F5912'
			},
			fontFamily: {
				sans: ['"Source Sans 3"', 'system-ui', 'sans-serif']
			}
		}
	}
} satisfies Config;
