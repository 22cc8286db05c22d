/**
 * The published sources the report may cite, with the inline author–year form used in the text
 * (and the patterns that find it) and the full citation of the References section. `firmness`
 * says how firmly the citation details were checked; it goes to the method notes, never into a
 * client sentence.
 */
export interface Reference {
  /** Inline form, e.g. "Knappe et al. 1998". */
  inline: string;
  /** Text patterns of the inline citation (any one found cites the source). */
  patterns: RegExp[];
  full: string;
  firmness: 'checked' | 'details to confirm';
}

export const REFERENCES: readonly Reference[] = [
  { inline: 'Altmann et al. 2014', patterns: [/Altmann et al\.? 2014/], full: 'Altmann, J., Ruhl, A.S., Zietzschmann, F., Jekel, M. (2014). Direct comparison of ozonation and adsorption onto powdered activated carbon for micropollutant removal in advanced wastewater treatment. Water Research 55, 185–193.', firmness: 'checked' },
  { inline: 'Altmann et al. 2016', patterns: [/Altmann et al\.? 2016/], full: 'Altmann, J., Massa, L., Sperlich, A., Gnirss, R., Jekel, M. (2016). UV254 absorbance as real-time monitoring and control parameter for micropollutant removal in advanced wastewater treatment with powdered activated carbon. Water Research 94, 240–245.', firmness: 'checked' },
  { inline: 'Crittenden, Berrigan & Hand 1986', patterns: [/Crittenden, Berrigan (&|and) Hand 1986/], full: 'Crittenden, J.C., Berrigan, J.K., Hand, D.W. (1986). Design of rapid small-scale adsorption tests for a constant diffusivity. Journal of the Water Pollution Control Federation 58(4), 312–319.', firmness: 'details to confirm' },
  { inline: 'Crittenden et al. 1985', patterns: [/Crittenden et al\.? 1985/], full: 'Crittenden, J.C., Luft, P., Hand, D.W. et al. (1985). Prediction of multicomponent adsorption equilibria using ideal adsorbed solution theory. Environmental Science & Technology 19(11), 1037–1043.', firmness: 'details to confirm' },
  { inline: 'Hyndman & Fan 1996', patterns: [/Hyndman (&|and) Fan/], full: 'Hyndman, R.J., Fan, Y. (1996). Sample quantiles in statistical packages. The American Statistician 50(4), 361–365.', firmness: 'checked' },
  { inline: 'Knappe et al. 1998', patterns: [/Knappe et al\.? 1998/], full: 'Knappe, D.R.U., Matsui, Y., Snoeyink, V.L., Roche, P., Prados, M.J., Bourbigot, M.-M. (1998). Predicting the capacity of powdered activated carbon for trace organic compounds in natural waters. Environmental Science & Technology 32(11), 1694–1698. doi:10.1021/es970833y.', firmness: 'checked' },
  { inline: 'Najm et al. 1991', patterns: [/Najm(, Snoeyink (&|and) Richard| et al\.?) 1991/], full: 'Najm, I.N., Snoeyink, V.L., Richard, Y. (1991). Effect of initial concentration of a SOC in natural water on its adsorption by activated carbon. Journal AWWA 83(8), 57–63.', firmness: 'details to confirm' },
  { inline: 'Qi et al. 2007', patterns: [/Qi et al\.? 2007/], full: 'Qi, S., Schideman, L., Mariñas, B.J., Snoeyink, V.L., Campos, C. (2007). Simplification of the IAST for activated carbon adsorption of trace organic compounds from natural water. Water Research 41(2), 440–448.', firmness: 'details to confirm' },
  { inline: 'Radke & Prausnitz 1972', patterns: [/Radke (&|and) Prausnitz/, /IAST/], full: 'Radke, C.J., Prausnitz, J.M. (1972). Thermodynamics of multi-solute adsorption from dilute liquid solutions. AIChE Journal 18(4), 761–768.', firmness: 'checked' },
  { inline: 'Schideman et al. 2006', patterns: [/Schideman et al\.? 2006/], full: 'Schideman, L.C., Mariñas, B.J., Snoeyink, V.L., Qi, S., Campos, C. (2006). Three-component competitive adsorption model for fixed-bed and moving-bed granular activated carbon adsorbers. Part I. Model development. Environmental Science & Technology 40(21), 6805–6811.', firmness: 'details to confirm' },
  { inline: 'SR 814.201.231', patterns: [/SR 814\.201\.231/], full: 'Swiss Federal Department of the Environment, Transport, Energy and Communications (DETEC) (2016). Ordinance of DETEC on the verification of the purification effect of measures to eliminate organic trace substances at wastewater treatment plants, SR 814.201.231, in force 1 December 2016.', firmness: 'checked' },
  { inline: 'Worch 2012', patterns: [/Worch 2012/, /adsorption analysis/], full: 'Worch, E. (2012). Adsorption Technology in Water Treatment: Fundamentals, Processes, and Modeling. De Gruyter, Berlin/Boston.', firmness: 'checked' },
  { inline: 'Zietzschmann et al. 2016', patterns: [/Zietzschmann et al\.? 2016/], full: 'Zietzschmann, F. et al. (2016). Water Research 102, 190 ff. (dose per mg DOC across seven treated-wastewater effluents; EBC concentration correlated with DOC).', firmness: 'details to confirm' },
];
