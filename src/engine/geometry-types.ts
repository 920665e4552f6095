/** A front-view position, mm: y to the left (outboard on the left corner), z up from the ground. */
export interface PointYZ {
  readonly y: number;
  readonly z: number;
}

/** A position with an optional fore–aft offset x (mm, + forward; 0 when absent). */
export interface PointYZX extends PointYZ {
  readonly x?: number;
}

/** A top-view position, mm: x forward, y left; z optional (a default is documented where it is used). */
export interface PointXYZ {
  readonly x: number;
  readonly y: number;
  readonly z?: number;
}

/** A top-view position, mm: x forward, y left (a vertical axis through it, as a bellcrank pivot's). */
export interface PointXY {
  readonly x: number;
  readonly y: number;
}
