/**
 * Dartelier's colours, defined once: the Tailwind theme (tailwind.config.ts), the editor's canvas and
 * the drawings of pieces read them from here. Every DEFAULT colour used for text reads at 4.5:1 or more
 * on paper (WCAG 2.2 AA); the `light` tones are for strokes and fills on the canvas, never for text.
 */
export const COLORS = {
	paper: { DEFAULT: '#F7F3EA', light: '#FFFCF5' },
	ink: { DEFAULT: '#1F2A37', soft: '#4D5663' },
	chalk: { DEFAULT: '#E4DED0', dark: '#CFC6B1' },
	indigo: { DEFAULT: '#2F4B7C', dark: '#223a61' },
	madder: { DEFAULT: '#A63D28', light: '#B5452F' },
	sage: { DEFAULT: '#476350', light: '#5E7D63' },
	ochre: { DEFAULT: '#7F5912', light: '#C08A2E' }
} as const;

/** A colour of the palette made partly transparent: `colorAlpha('#1F2A37', 0.16)` → "rgba(31, 42, 55, 0.16)". */
export function colorAlpha(hex: string, alpha: number): string {
	const n = parseInt(hex.slice(1), 16);
	return `rgba(${(n >> 16) & 255}, ${(n >> 8) & 255}, ${n & 255}, ${alpha})`;
}
