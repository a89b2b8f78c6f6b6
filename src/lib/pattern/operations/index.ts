/** The dart operations; the recipe registry (../recipe/registry.ts) maps step names to them. */
export { cap, capParamsSchema, type CapParams } from './cap';
export { pivot, pivotParamsSchema, type PivotParams } from './pivot';
export { pleat, pleatParamsSchema, equalIntakeAngles, SUBSTITUTE_PIVOT_MAX_RADIUS_MM, type PleatParams } from './pleat';
export { pullBack, pullBackParamsSchema, sewnPointFor, type PullBackParams } from './pull-back';
export { share, shareParamsSchema, resolveShares, type ShareParams } from './share';
export { spread, spreadParamsSchema, type SpreadParams } from './spread';
