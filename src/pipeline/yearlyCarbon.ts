/**
 * Carbon over a year at one constant dose and flow (no DOC series):
 *   carbon, kg/a = dose (mg/L = g/m³) × flow (m³/d) × 365 d / 1000,
 *   cost per year = kg/a × price per kg.
 * Used by the run and by the sensitivity step, so the two agree by construction.
 */
export function yearlyCarbonAtDose(doseMgPerL: number, flowM3PerD: number, pricePerKg: number): { carbonKg: number; cost: number } {
  const carbonKg = (doseMgPerL * flowM3PerD * 365) / 1000; // g/m³ × m³/d × d / (g/kg)
  return { carbonKg, cost: carbonKg * pricePerKg };
}
