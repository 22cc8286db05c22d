/**
 * PAC contact kinetics speed (issue 9 targets): batch over 24 h of the 6-component water
 * (non-adsorbable + 4 fictive DOC components + one trace target), the stirred reactor at steady
 * state, a dose under contact conditions (plug flow and stirred), and a carbon's whole design
 * under a stirred contact tank (9 trace targets sharing one background: ContactRemoval). Best of several rounds after
 * a warm-up (the machine may be shared; the engine compiles the hot loops in the first rounds),
 * with the CPU time and the work counts (steps, factorisations, particle integrations, kinetic
 * solves) beside, which do not depend on the load. Invented water; figures only, not pass/fail.
 */
import { loadavg } from 'node:os';
import { prepareKinetics, type KineticComponent } from '../../src/kinetics/kineticMixture.js';
import { pacBatch } from '../../src/kinetics/pacBatch.js';
import { stirredReactor } from '../../src/kinetics/stirredReactor.js';
import { ContactRemoval, doseUnderContact } from '../../src/kinetics/contactRemoval.js';
import { designDose } from '../../src/design/designDose.js';
import type { CompetitionSet } from '../../src/design/removalModel.js';
import type { BenchFigure } from './run.js';

const doc = { oneOverN: 0.2, dsM2PerS: 5e-17, dlM2PerS: 5e-10 };
const WATER: KineticComponent[] = [
  { id: 'N', c0MgPerL: 1, K: 0, oneOverN: 1 },
  { id: 'F1', c0MgPerL: 1, K: 5, ...doc },
  { id: 'F2', c0MgPerL: 1.5, K: 20, ...doc },
  { id: 'F3', c0MgPerL: 1, K: 60, ...doc },
  { id: 'F4', c0MgPerL: 0.5, K: 150, ...doc },
  { id: 'T', c0MgPerL: 1e-4, K: 200, oneOverN: 0.4, dsM2PerS: 2e-16, dlM2PerS: 7e-10 },
];
const particle = { radiusM: 10e-6, densityGPerL: 650 };

/** Nine invented trace targets (K, 1/n, Ds) in the four fictive DOC components of WATER. */
const TARGETS: Array<[number, number, number]> = [[200, 0.4, 3e-16], [100, 0.35, 2e-16], [50, 0.3, 3e-16], [300, 0.45, 1e-16], [80, 0.4, 3e-16], [30, 0.3, 4e-16], [60, 0.35, 6e-16], [150, 0.4, 1.5e-16], [90, 0.3, 5e-16]];
const SETS: CompetitionSet[] = TARGETS.map(([K, oneOverN, ds], k) => ({ target: { id: `T${k + 1}`, c0MgPerL: 1e-3, K, oneOverN, dsM2PerS: ds, dlM2PerS: 7e-10 } as CompetitionSet['target'], competitors: WATER.slice(0, 5) }));
const GOALS = TARGETS.map(() => ({ kind: 'removal' as const, removalFraction: 0.8, text: '80 % removal' }));

/** Best wall time and CPU time (user + system) of a few rounds after `warm` unmeasured ones, ms, and the last result. */
function best<T>(warm: number, rounds: number, f: () => T): { ms: number; cpuMs: number; result: T } {
  let ms = Infinity, cpuMs = Infinity;
  let result!: T;
  for (let k = 0; k < warm; k++) result = f();
  for (let k = 0; k < rounds; k++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    result = f();
    ms = Math.min(ms, performance.now() - t0);
    const cu = process.cpuUsage(c0);
    cpuMs = Math.min(cpuMs, (cu.user + cu.system) / 1000);
  }
  return { ms, cpuMs, result };
}

export async function bench(): Promise<BenchFigure[]> {
  const pk = prepareKinetics(WATER, particle);
  const load = loadavg()[0]!;
  const batch = best(5, 20, () => pacBatch(pk, 0.02, [60, 300, 900, 1800, 3600, 86400]));
  const reactor = best(2, 5, () => stirredReactor(pk, 0.02, 1800, 3 * 86400));
  const young = best(2, 5, () => stirredReactor(pk, 0.02, 1800, 1800));
  const doseYoung = best(1, 2, () => doseUnderContact(pk, 5, 0.8, { kind: 'stirred', contactTimeS: 1800, carbonAgeS: 1800 }));
  const dose = best(1, 3, () => doseUnderContact(pk, 5, 0.8, { kind: 'plug-flow', contactTimeS: 1800 }));
  const doseStirred = best(1, 2, () => doseUnderContact(pk, 5, 0.8, { kind: 'stirred', contactTimeS: 1800, carbonAgeS: 3 * 86400 }));
  const stirred = { kind: 'stirred' as const, contactTimeS: 1800, carbonAgeS: 3 * 86400 };
  let design!: ContactRemoval;
  const carbon = best(0, 2, () => { design = new ContactRemoval(SETS, 5, particle, stirred); return designDose(design, { goals: GOALS, pricePerKg: 2 }); });
  const designSolves = (design as unknown as { shared: Array<{ group: { solved: Map<number, unknown> } } | undefined> }).shared[0]?.group.solved.size ?? 0;
  const s = batch.result.stats;
  return [
    { name: 'PAC batch over 24 h, 6 components', value: batch.ms, unit: 'ms', target: '≤ 5 ms' },
    { name: '  CPU time; steps (rejected), factorisations', value: batch.cpuMs, unit: `ms; ${s.steps} (${s.rejectedSteps}), ${s.factorizations}` },
    { name: 'stirred contact reactor at steady state (θ = 3 d)', value: reactor.ms, unit: 'ms', target: '≤ 20 ms' },
    { name: '  CPU time; particle integrations (coarse + fine)', value: reactor.cpuMs, unit: `ms; ${reactor.result.integrations}` },
    { name: 'stirred contact reactor without recirculation (θ = τ = 30 min)', value: young.ms, unit: 'ms' },
    { name: '  CPU time; particle integrations (coarse + fine)', value: young.cpuMs, unit: `ms; ${young.result.integrations}` },
    { name: 'dose under contact conditions (stirred, θ = τ = 30 min)', value: doseYoung.ms, unit: 'ms' },
    { name: '  CPU time; kinetic solves', value: doseYoung.cpuMs, unit: `ms; ${doseYoung.result.evaluations}` },
    { name: 'dose under contact conditions (plug flow, 30 min)', value: dose.ms, unit: 'ms', target: '≤ 100 ms' },
    { name: '  CPU time; kinetic solves', value: dose.cpuMs, unit: `ms; ${dose.result.evaluations}` },
    { name: 'dose under contact conditions (stirred, 30 min, θ = 3 d)', value: doseStirred.ms, unit: 'ms' },
    { name: '  CPU time; kinetic solves', value: doseStirred.cpuMs, unit: `ms; ${doseStirred.result.evaluations}` },
    { name: "a carbon's design under contact (9 targets, stirred, θ = 3 d)", value: carbon.ms, unit: 'ms' },
    { name: '  CPU time; shared background solves', value: carbon.cpuMs, unit: `ms; ${designSolves}` },
    { name: 'load average (1 min) when the kinetics bench started', value: load, unit: 'on 2 cores' },
  ];
}
