/** The cautions the tool shows, in the summary and the report. */
export const CAUTIONS: readonly string[] = [
  'Results are planning estimates from adsorption models (equilibrium and, where the project gives them, contact and fixed-bed kinetics). Contact time, carbon age, preloading, mixing and temperature reduce real removal, and the kinetic parameters are uncertain; confirm with jar and pilot tests.',
  'Leave design decisions to a licensed engineer under the local discharge permit and codes.',
  'Carbon dust is combustible and needs the usual handling precautions.',
  'Mass-based IAST assumes equal molar masses of the components; DOC fictive components stay mass-based, as in common practice.',
];
