/**
 * The excess of a removal goal at a dose, the function every compound dose search solves:
 *   e = ln(1 − R) − ln(c/c0)
 * (positive when more than the goal R is removed). On the log of the remaining fraction so that
 * goals near 100 % keep their relative precision; it rises with the dose because c/c0 falls.
 * A remaining fraction that underflows to 0 counts as the smallest positive number, so e stays
 * finite.
 */
export function removalExcess(remainingFraction: number, removalGoal: number): number {
  return Math.log1p(-removalGoal) - Math.log(Math.max(remainingFraction, Number.MIN_VALUE));
}
