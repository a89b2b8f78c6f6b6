import { allowanceMove, type AllowanceState } from './allowance';
import { capMove, type CapState } from './cap';
import { carryMove, type CarryState } from './carry';
import { foldMove, type FoldState } from './fold';
import { grainMove, type GrainState } from './grain';
import { joinMove, type JoinState } from './join';
import { measureMove, type MeasureState } from './measure';
import { notchMove, type NotchState } from './notch';
import { pivotMove, type PivotState } from './pivot';
import { pleatMove, type PleatState } from './pleat';
import { pullBackMove, type PullBackState } from './pull-back';
import { reshapeMove, type ReshapeState } from './reshape';
import { selectMove, type SelectState } from './select';
import { separateMove, type SeparateState } from './separate';
import { shareMove, type ShareState } from './share';
import { spreadMove, type SpreadState } from './spread';
import { styleLineMove, type StyleLineState } from './style-line';
import { trueSeamMove, type TrueSeamState } from './true-seam';
import type { MoveDef, MoveId } from './types';

/** The state of the move under way: one type per move, told apart by `id`. */
export type MoveState =
	| SelectState
	| PivotState
	| ShareState
	| PleatState
	| PullBackState
	| CapState
	| StyleLineState
	| SeparateState
	| SpreadState
	| NotchState
	| GrainState
	| FoldState
	| AllowanceState
	| MeasureState
	| JoinState
	| CarryState
	| TrueSeamState
	| ReshapeState;

export type MoveStateOf<K extends MoveId> = Extract<MoveState, { id: K }>;

/** Every move of the editor. */
export const MOVES: { readonly [K in MoveId]: MoveDef<MoveStateOf<K>> } = {
	select: selectMove,
	pivot: pivotMove,
	share: shareMove,
	pleat: pleatMove,
	pull_back: pullBackMove,
	cap: capMove,
	style_line: styleLineMove,
	separate: separateMove,
	spread: spreadMove,
	notch: notchMove,
	grain: grainMove,
	fold: foldMove,
	allowance: allowanceMove,
	measure: measureMove,
	join: joinMove,
	carry: carryMove,
	true_seam: trueSeamMove,
	reshape: reshapeMove
};

/** The definition of the move a state belongs to. */
export function moveDef<S extends MoveState>(st: S): MoveDef<S> {
	return MOVES[st.id] as unknown as MoveDef<S>;
}

export const MOVE_ORDER: readonly MoveId[] = ['select', 'pivot', 'share', 'spread', 'pleat', 'pull_back', 'cap', 'style_line', 'separate', 'join', 'carry', 'true_seam', 'notch', 'grain', 'fold', 'allowance', 'reshape', 'measure'];
