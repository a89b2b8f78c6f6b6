/**
 * The one place the pattern model imports the geometry kernel from (src/lib/geometry).
 */
export * from '../geometry';
export { outlineNearestLocation } from './locate';
