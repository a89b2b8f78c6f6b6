// Minimal types for bezier-js 6 (used only as a reference in tests; the package ships no types).
declare module 'bezier-js' {
	export class Bezier {
		constructor(...coords: number[]);
		length(): number;
		bbox(): { x: { min: number; max: number }; y: { min: number; max: number } };
	}
}
