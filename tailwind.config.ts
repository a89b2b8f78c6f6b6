import type { Config } from 'tailwindcss';
import { COLORS } from './src/lib/palette';

/**
 * Dartelier's palette (src/lib/palette.ts) and type. Every colour used for text reads at 4.5:1 or more
 * (WCAG 2.2 AA, checked by axe in the browser tests) on paper, on white and on its own 10 % tint;
 * greyed text is `ink-soft`, never ink made transparent (ink at 60 % falls to 3.9:1 on paper).
 */
export default {
	content: ['./src/**/*.{html,svelte,ts}'],
	theme: {
		extend: {
			// the one palette (src/lib/palette.ts): bg-paper, text-ink-soft, stroke-madder-light …
			colors: COLORS,
			fontFamily: {
				sans: ['"Source Sans 3"', 'system-ui', 'sans-serif']
			}
		}
	}
} satisfies Config;
