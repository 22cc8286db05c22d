/**
 * Carbon mass and cost from a dose, the one place they are computed:
 *   carbon mass, kg/d = dose (mg/L = g/m³) × flow (m³/d) / 1000
 *   cost per m³ treated = dose (g/m³) / 1000 × price per kg
 *   cost = mass (kg) × price per kg
 * Units as named; the price is in the carbon's currency per kg.
 */

/** Carbon mass, kg/d, at a dose (mg/L) and flow (m³/d). */
export function carbonKgPerD(doseMgPerL: number, flowM3PerD: number): number {
  return (doseMgPerL * flowM3PerD) / 1000;
}

/** Carbon cost per m³ treated at a dose (mg/L). */
export function costPerM3(doseMgPerL: number, pricePerKg: number): number {
  return (doseMgPerL / 1000) * pricePerKg;
}

/** Cost of a carbon mass (kg). */
export function carbonCost(kg: number, pricePerKg: number): number {
  return kg * pricePerKg;
}
