/** The canvas colours: the same palette as tailwind.config.ts (paper, ink, chalk, indigo, madder, sage, ochre). */
export const PALETTE = {
	paper: '#F7F3EA',
	pieceFill: '#FFFCF5',
	ink: '#1F2A37',
	chalk: '#E4DED0',
	gridMajor: '#CFC6B1',
	/** The faint shadow of a piece of paper on the table (ink, mostly transparent). */
	shadow: 'rgba(31, 42, 55, 0.16)',
	indigo: '#2F4B7C',
	madder: '#B5452F',
	sage: '#5E7D63',
	ochre: '#C08A2E'
} as const;
