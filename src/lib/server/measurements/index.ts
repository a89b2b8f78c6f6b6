// Measurement sets of a studio (charts and client sets) and drafting a block into a new style.
export * from './charts';
export * from './sets';
export * from './draft';
