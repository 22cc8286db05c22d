export { buildReportModel } from './buildReportModel.js';
export { runRecord, type RunEnvironment } from './runRecord.js';
export { CAUTIONS } from './cautions.js';
export { toCsv, compoundsCsv, removalCurvesCsv, carbonsCsv, dailyDosesCsv, indicatorsCsv } from './outputTables.js';
export { surrogatesCsv, setpointsCsv, pilotCheckCsv, gacCsv, uncertaintyCsv } from './surrogateGacUncertaintyTables.js';
export { fmtNumber, fmtConcentration, fmtMoney, fmtWhole } from './formatting.js';
export * from './reportModel.js';
export * from './formatNumber.js';
