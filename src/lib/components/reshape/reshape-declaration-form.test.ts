import { render } from 'svelte/server';
import { describe, expect, it } from 'vitest';
import { frontBodiceBlock } from '$lib/pattern/fixtures/front-bodice-block';
import { reshapeChanges } from '$lib/pattern/reshape-declaration';
import { reshape } from '$lib/pattern/verify/reshape';
import ReshapeDeclaration from './ReshapeDeclaration.svelte';

const block = frontBodiceBlock();
const moved = reshape(block, { moves: [{ from: { x: 225, y: 440 }, to: { x: 225, y: 446 } }] });
if (!moved.ok) throw new Error(moved.error.message);
const changes = reshapeChanges(block, moved.piece);

function html(unit: 'mm' | 'cm' | 'in'): string {
	return render(ReshapeDeclaration, { props: { changes, unit, ondeclare: () => {} } }).body;
}

describe('the reshape declaration form', () => {
	it('shows each change with its values before and after and the difference, in the user unit', () => {
		const side = changes.find((c) => c.label === 'Side seam')!;
		const mm = html('mm');
		expect(mm).toContain('Side seam');
		expect(mm).toContain(`${side.before!.toFixed(1)} mm → ${side.after!.toFixed(1)} mm`);
		expect(mm).toContain(`(+${side.difference.toFixed(1)} mm)`);
		expect(mm).toMatch(/Area outside the darts/);
		expect(mm).toMatch(/\(\+\d+ mm²\)/);
		const inches = html('in');
		expect(inches).toMatch(/\(\+1\/4 in\)/); // 6.0 mm ≈ 0.236 in → 1/4 to the nearest sixteenth
		expect(inches).toMatch(/in²/);
	});

	it('labels every control: a radio button per choice, a note field per change, the suggested choice checked', () => {
		const out = html('cm');
		const radios = [...out.matchAll(/<input[^>]*type="radio"[^>]*>/g)].map((m) => m[0]);
		expect(radios).toHaveLength(changes.length * 3);
		// each radio button sits inside its label, which names the choice
		const labelled = [...out.matchAll(/<label[^>]*>\s*<input[^>]*type="radio"[^>]*>\s*(?:<!---->)?\s*([A-Z][a-z]+(?: [a-z]+)?)/g)].map((m) => m[1]);
		expect(labelled).toHaveLength(radios.length);
		// in the order of the changes, the words follow the change's direction (the waist gets shorter)
		expect(labelled).toEqual(changes.flatMap((c) => (c.addsCloth ? ['Added ease', 'Added fullness', 'Other'] : ['Removed ease', 'Removed fullness', 'Other'])));
		expect(changes.some((c) => !c.addsCloth)).toBe(true);
		// one choice checked per change: the suggested one
		const checked = [...out.matchAll(/<input[^>]*type="radio"[^>]*value="(\w+)"[^>]*checked[^>]*>|<input[^>]*checked[^>]*type="radio"[^>]*value="(\w+)"[^>]*>/g)].map((m) => m[1] ?? m[2]);
		expect(checked).toEqual(changes.map((c) => c.suggested));
		const notes = [...out.matchAll(/<input[^>]*id="([^"]+-note)"/g)].map((m) => m[1]);
		expect(notes).toHaveLength(changes.length);
		for (const id of notes) expect(out).toContain(`for="${id}"`);
	});

	it('says there is nothing to declare when the reshape kept everything', () => {
		const out = render(ReshapeDeclaration, { props: { changes: [], unit: 'mm', ondeclare: () => {} } }).body;
		expect(out).toContain('Nothing to declare');
		expect(out).not.toContain('type="radio"');
	});
});
