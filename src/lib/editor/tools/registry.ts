import { capTool } from './cap';
import { carryTool } from './carry';
import { joinTool } from './join';
import { trueSeamTool } from './true-seam';
import { allowanceTool, foldTool, grainTool, notchTool } from './marks';
import { spreadTool } from './spread';
import { measureTool } from './measure';
import { pivotTool } from './pivot';
import { pleatTool } from './pleat';
import { pullBackTool } from './pull-back';
import { selectTool } from './select';
import { separateTool } from './separate';
import { shareTool } from './share';
import { styleLineTool } from './style-line';
import type { ToolDef, ToolId } from './types';

/** Every tool of the editor, in toolbar order. */
export const TOOLS: Record<ToolId, ToolDef> = {
	select: selectTool,
	pivot: pivotTool,
	share: shareTool,
	pleat: pleatTool,
	pull_back: pullBackTool,
	cap: capTool,
	style_line: styleLineTool,
	separate: separateTool,
	spread: spreadTool,
	notch: notchTool,
	grain: grainTool,
	fold: foldTool,
	allowance: allowanceTool,
	measure: measureTool,
	join: joinTool,
	carry: carryTool,
	true_seam: trueSeamTool
};

export const TOOL_ORDER: readonly ToolId[] = ['select', 'pivot', 'share', 'spread', 'pleat', 'pull_back', 'cap', 'style_line', 'separate', 'join', 'carry', 'true_seam', 'notch', 'grain', 'fold', 'allowance', 'measure'];
