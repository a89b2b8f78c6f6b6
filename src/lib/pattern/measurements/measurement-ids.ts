/**
 * Body measurement ids and their definitions, in our own words after ISO 8559-1 / EN 13402-1
 * (reference-values row 5 for bust girth, C paraphrase; the other definitions follow the same
 * standards' landmarks, worded by us). Values are stored in millimetres.
 */
export const measurementIds = [
	'bust',
	'underbust',
	'waist',
	'hip',
	'neck_base',
	'upper_chest',
	'back_length',
	'front_length',
	'armhole_depth',
	'shoulder_length',
	'across_back',
	'across_front',
	'bust_point_separation',
	'shoulder_to_bust_point',
	'height'
] as const;

export type MeasurementId = (typeof measurementIds)[number];

export interface MeasurementDefinition {
	readonly id: MeasurementId;
	/** Short label for a form field. */
	readonly label: string;
	/** How to take it, shown beside the field. */
	readonly definition: string;
	/** girth (around the body), length (along the body) or width (across it). */
	readonly dimension: 'girth' | 'length' | 'width';
}

const d = (
	id: MeasurementId,
	label: string,
	dimension: MeasurementDefinition['dimension'],
	definition: string
): MeasurementDefinition => ({ id, label, dimension, definition });

export const measurementDefinitions: Readonly<Record<MeasurementId, MeasurementDefinition>> = {
	bust: d(
		'bust',
		'Bust girth',
		'girth',
		'The largest horizontal girth of the torso, taken standing and breathing normally, with the tape passing under the arms and over the most prominent points of the bust.'
	),
	underbust: d(
		'underbust',
		'Under-bust girth',
		'girth',
		'Horizontal girth of the ribcage directly below the breasts, where the breast meets the chest wall.'
	),
	waist: d(
		'waist',
		'Waist girth',
		'girth',
		'Horizontal girth at the natural waist: the narrowest part of the torso between the lowest rib and the top of the hip bone, breathing normally, without pulling the tape in.'
	),
	hip: d('hip', 'Hip girth', 'girth', 'Largest horizontal girth around the buttocks, standing with the feet together.'),
	neck_base: d(
		'neck_base',
		'Neck base girth',
		'girth',
		'Girth at the base of the neck, passing over the prominent vertebra at the back (the nape), the points where neck meets shoulder, and the top of the breastbone in front.'
	),
	upper_chest: d(
		'upper_chest',
		'Upper chest girth',
		'girth',
		'Horizontal girth high under the arms, above the breasts, with the tape across the shoulder blades at the back.'
	),
	back_length: d(
		'back_length',
		'Back length (nape to waist)',
		'length',
		'Along the spine, from the nape (the prominent vertebra at the base of the neck) down to the waist line.'
	),
	front_length: d(
		'front_length',
		'Front length',
		'length',
		'From the side neck point over the bust point and straight down to the waist line.'
	),
	armhole_depth: d(
		'armhole_depth',
		'Armhole depth',
		'length',
		'Vertical distance from the nape down to the level of the armpits (the underarm line).'
	),
	shoulder_length: d(
		'shoulder_length',
		'Shoulder length',
		'length',
		'From the side neck point to the shoulder point (the outer tip of the shoulder bone), along the top of the shoulder.'
	),
	across_back: d(
		'across_back',
		'Across back',
		'width',
		'Across the back between the creases where the arms join the body, about halfway between the nape and the underarm line.'
	),
	across_front: d(
		'across_front',
		'Across front',
		'width',
		'Across the chest between the creases where the arms join the body, above the bust.'
	),
	bust_point_separation: d(
		'bust_point_separation',
		'Bust point separation',
		'width',
		'Straight horizontal distance between the two bust points (the most prominent points of the breasts).'
	),
	shoulder_to_bust_point: d(
		'shoulder_to_bust_point',
		'Side neck point to bust point',
		'length',
		'From the side neck point, over the body, to the bust point on the same side.'
	),
	height: d('height', 'Height', 'length', 'Standing height without shoes, from the floor to the top of the head.')
};
