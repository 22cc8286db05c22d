/**
 * A stiff system in logarithmic time: s = ln(1 + t/t_c), so dy/ds = (t + t_c)·f(t, y) and the
 * Newton matrix I − g·(t + t_c)·J. A particle taking up solute by diffusion changes about as fast
 * at every time scale (q̄ ∝ √t early, exponential approach late), so in s the integrator keeps
 * nearly constant steps instead of growing them without end (ours; the change of independent
 * variable is exact, the accuracy is that of the integrator in s).
 *
 * Units: t and t_c in the model's time unit; s dimensionless.
 */
import type { StiffSystem } from './implicitIntegrator.js';

/** s for a time t ≥ 0. */
export function logTime(tS: number, timeScaleS: number): number {
  return Math.log1p(tS / timeScaleS);
}

/** The system in s = ln(1 + t/t_c) (t_c > 0). */
export function logTimeSystem(system: StiffSystem, timeScaleS: number): StiffSystem {
  const tc = timeScaleS;
  return {
    size: system.size,
    what: system.what,
    rhs(s, y, dy) {
      const t = tc * Math.expm1(s);
      system.rhs(t, y, dy);
      const f = t + tc;
      for (let i = 0; i < dy.length; i++) dy[i] = dy[i]! * f;
    },
    factor(s, y, g) {
      const t = tc * Math.expm1(s);
      return system.factor(t, y, g * (t + tc));
    },
  };
}

/** Time scale for a particle (ours): 1e-5 of the fastest diffusion time R²/Ds, where the film and the first layer of nodes have settled. */
export function particleTimeScale(radiusM: number, dsM2PerS: readonly number[]): number {
  const fastest = Math.max(...dsM2PerS.filter((d) => d > 0), 0);
  return fastest > 0 ? 1e-5 * (radiusM * radiusM) / fastest : 1;
}
