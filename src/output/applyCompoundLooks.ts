/**
 * Gives every figure of a report model the same look per compound: each series whose `key` is a
 * compound id gets that compound's colour and marker (compoundStyles, assigned once from the
 * compound table's order), compound series are put in the order of the compound table (legends
 * follow it), and the DOC and UV254 reduction lines and reference curves get neutral styles of
 * their own. Series keys: a compound id, or one of NEUTRAL_KEYS. Returns a new model.
 */
import { compoundStyles } from './compoundStyles.js';
import type { PlotSeries, PlotSpec, ReportModel } from './reportModel.js';
import { NEUTRAL_STYLES } from './palette.js';

/** Keys of the series that are not compounds. */
export const NEUTRAL_KEYS = { doc: 'doc-reduction', uv254: 'uv254-reduction', reference: 'reference' } as const;

function neutral(s: PlotSeries): PlotSeries | undefined {
  const look = s.key === NEUTRAL_KEYS.doc ? NEUTRAL_STYLES.doc : s.key === NEUTRAL_KEYS.uv254 ? NEUTRAL_STYLES.uv254 : s.key === NEUTRAL_KEYS.reference ? NEUTRAL_STYLES.reference : undefined;
  return look ? { ...s, colour: look.colour, dash: look.dash } : undefined;
}

function restyle(p: PlotSpec, order: Map<string, number>, looks: ReturnType<typeof compoundStyles>): PlotSpec {
  if (p.kind !== 'xy') return p;
  const styled = p.series.map((s) => {
    const look = s.key !== undefined ? looks.get(s.key) : undefined;
    if (look) return { ...s, colour: look.colour, marker: look.marker };
    return neutral(s) ?? s;
  });
  // compound series take the slots compound series had, in the compound table's order
  const slots = styled.flatMap((s, i) => (s.key !== undefined && order.has(s.key) ? [i] : []));
  const sorted = slots.map((i) => styled[i]!).sort((a, b) => order.get(a.key!)! - order.get(b.key!)!);
  const series = styled.slice();
  slots.forEach((slot, k) => (series[slot] = sorted[k]!));
  return { ...p, series };
}

/** The model with compound looks applied to every x–y figure. */
export function applyCompoundLooks(model: ReportModel, compoundIds: readonly string[]): ReportModel {
  const looks = compoundStyles(compoundIds);
  const order = new Map(compoundIds.map((id, i) => [id, i] as const));
  return { ...model, sections: model.sections.map((s) => (s.plots ? { ...s, plots: s.plots.map((p) => restyle(p, order, looks)) } : s)) };
}
