/**
 * The `fmin` package's Nelder–Mead minimiser (Nelder & Mead 1965, Computer Journal 7(4):308–313),
 * made loadable from ES modules.
 *
 * fmin 0.0.4 declares `"type": "module"` but ships a UMD bundle: imported as an ES module it
 * exports nothing and instead sets `globalThis.fmin`; loaded as CommonJS (some test runners) or
 * from `node -e` (whose scope has a global `exports`) it fills `exports`. This adapter accepts all.
 */
import * as fminNamespace from 'fmin';
import type { FminParams, FminResult } from 'fmin';

type NelderMead = (f: (x: number[]) => number, x0: number[], parameters?: FminParams) => FminResult;

function resolve(): NelderMead {
  const ns = fminNamespace as unknown as { nelderMead?: NelderMead; default?: { nelderMead?: NelderMead } };
  const g = globalThis as { fmin?: { nelderMead?: NelderMead }; exports?: { nelderMead?: NelderMead } };
  // Under `node -e` the eval scope defines a global `exports`, and the UMD wrapper fills that.
  const nm = ns.nelderMead ?? ns.default?.nelderMead ?? g.fmin?.nelderMead ?? g.exports?.nelderMead;
  if (typeof nm !== 'function') throw new Error('the fmin package did not provide nelderMead');
  return nm;
}

/** fmin's nelderMead (see the file comment). */
export const nelderMead: NelderMead = resolve();
