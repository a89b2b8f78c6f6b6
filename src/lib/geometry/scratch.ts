/**
 * Working arrays kept between calls of the kernel's searches (internal, not re-exported by index.ts).
 * The self-crossing checks run on every step of a drag over outlines of thousands of segments;
 * allocating and zeroing their typed arrays each time cost a good part of the search. A caller asks for
 * slot k of at least `size` entries and must write every entry it reads; nothing in them outlives the
 * call that asked (no search calls back out while it holds them, and each caller has its own slots).
 */
export class ScratchArrays {
	private readonly floats: Float64Array[] = [];
	private readonly ints: Int32Array[] = [];

	float64(slot: number, size: number): Float64Array {
		const a = this.floats[slot];
		if (a && a.length >= size) return a;
		return (this.floats[slot] = new Float64Array(Math.ceil(size * 1.25)));
	}

	int32(slot: number, size: number): Int32Array {
		const a = this.ints[slot];
		if (a && a.length >= size) return a;
		return (this.ints[slot] = new Int32Array(Math.ceil(size * 1.25)));
	}
}
