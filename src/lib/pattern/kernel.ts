/**
 * The one place the pattern model imports the geometry kernel from (src/lib/geometry).
 */
export * from '../geometry';
/** Nearest place on an outline (the kernel's outlineNearestPoint, under the name the operations use). */
export { outlineNearestPoint as outlineNearestLocation } from '../geometry';
