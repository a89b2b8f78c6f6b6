export * from './measurement-ids';
export * from './measurement-set';
export * from './units';
export * from './astm-d5585-chart';
export * from './derived';
export * from './cup-code';
export * from './plausibility';
export * from './length-field';
