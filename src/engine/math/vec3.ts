/** A point or direction in the vehicle frame (ISO 8855: x forward, y left, z up), millimetres for points. */
export type Vec3 = readonly [number, number, number];
