/**
 * Test helper: relative-tolerance comparison whose failure message prints actual, expected and the error, so a
 * failing check against a published value says by how much it missed.
 */
export function expectClose(actual: number, expected: number, relativeTolerance: number, what = 'value'): void {
  const error = expected === 0 ? Math.abs(actual) : Math.abs(actual - expected) / Math.abs(expected);
  if (!(error <= relativeTolerance)) {
    throw new Error(`${what}: actual ${actual}, expected ${expected}, relative error ${error.toExponential(3)} > ${relativeTolerance}`);
  }
}
