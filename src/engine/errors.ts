/**
 * Impossible or invalid geometry, named for the designer: which part and why
 * ("shaft neck": "neck diameter 9 mm is not smaller than the cup mouth 8 mm").
 * The engine throws this instead of ever returning NaN or Infinity.
 */
export class GeometryError extends Error {
  readonly part: string;
  readonly reason: string;

  constructor(part: string, reason: string) {
    super(`${part}: ${reason}`);
    this.name = "GeometryError";
    this.part = part;
    this.reason = reason;
  }
}
