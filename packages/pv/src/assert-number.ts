/** Limits for {@link assertNumber}. */
export type NumberLimits = {
  readonly min?: number;
  readonly max?: number;
  readonly greaterThan?: number;
  readonly lessThan?: number;
  readonly integer?: boolean;
};

/**
 * Throws a RangeError naming `name` unless `value` is a finite number inside the limits.
 * Programmer errors throw in this package; user input is parsed with zod before it gets here.
 */
export function assertNumber(value: number, name: string, limits: NumberLimits = {}): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number, got ${String(value)}`);
  }
  if (limits.integer === true && !Number.isInteger(value)) {
    throw new RangeError(`${name} must be a whole number, got ${value}`);
  }
  if (limits.min !== undefined && value < limits.min) {
    throw new RangeError(`${name} must be at least ${limits.min}, got ${value}`);
  }
  if (limits.max !== undefined && value > limits.max) {
    throw new RangeError(`${name} must be at most ${limits.max}, got ${value}`);
  }
  if (limits.greaterThan !== undefined && !(value > limits.greaterThan)) {
    throw new RangeError(`${name} must be more than ${limits.greaterThan}, got ${value}`);
  }
  if (limits.lessThan !== undefined && !(value < limits.lessThan)) {
    throw new RangeError(`${name} must be less than ${limits.lessThan}, got ${value}`);
  }
}
