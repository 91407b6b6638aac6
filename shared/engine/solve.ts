/**
 * Bracketed root finding for required thickness and mode cross-overs.
 * Brent's method (Brent, R. P., Algorithms for Minimization without Derivatives, 1973, ch. 4):
 * inverse quadratic interpolation / secant steps, falling back to bisection, so it keeps the
 * bracket and always converges for a continuous function with a sign change (and still closes
 * in on a jump, which bisection alone would also do).
 */

/**
 * A root of f(·, ctx) in [a, b], given f(a) and f(b) of opposite sign (or one of them zero).
 * (`ctx` is passed through to f so callers need not build a closure per call.)
 * Stops when the bracket is narrower than `xtol` + 4ε|x|, when |f| ≤ `ftol` (then the point
 * itself is returned, whichever side it is on), or after `maxIter` steps.
 * Returns the end of the final bracket where f ≥ 0 (for an increasing f: the side that meets
 * the target, even when f jumps across zero).
 */
export function brent<C>(
  f: (x: number, ctx: C) => number,
  ctx: C,
  a: number,
  b: number,
  fa: number,
  fb: number,
  xtol = 0,
  maxIter = 200,
  ftol = 0,
): number {
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) throw new RangeError('brent: the root is not bracketed');
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < maxIter; iter++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * xtol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return fb >= 0 ? b : c;
    if (Math.abs(fb) <= ftol) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b, ctx);
  }
  if (fb * fc > 0) return b;
  return fb >= 0 ? b : c;
}

interface LogProblem<C> {
  sf: (t: number, ctx: C) => number;
  ctx: C;
  lnTarget: number;
}

/** ln sf(e^u) − ln target. */
function logResidual<C>(u: number, q: LogProblem<C>): number {
  const s = q.sf(Math.exp(u), q.ctx);
  return s > 0 ? Math.log(s) - q.lnTarget : -1000;
}

/**
 * The thickness at which a non-decreasing function `sf(t, ctx)` (a safety factor) reaches
 * `target`. Works in logarithms (ln sf against ln t is close to a straight line of slope
 * `exponent` for the power laws of shell buckling), stepping by secant from `guess` until the root
 * is bracketed, then refining with Brent to a relative tolerance of 1e-9 in t or in sf. A point
 * already known (`tKnown`, `sfKnown`, e.g. the evaluated thickness) seeds the secant and may
 * already bracket the root, saving evaluations. Returns a thickness where
 * sf ≥ target·(1 − 1e-9); null when even `tMax` does not reach the target; `tMin` when `tMin`
 * already does.
 */
export function thicknessForTarget<C>(
  sf: (t: number, ctx: C) => number,
  ctx: C,
  target: number,
  guess: number,
  tMin: number,
  tMax: number,
  exponent = 2,
  tKnown = 0,
  sfKnown = 0,
): number | null {
  const q: LogProblem<C> = { sf, ctx, lnTarget: Math.log(target) };
  const uMin = Math.log(tMin);
  const uMax = Math.log(tMax);
  let u0 = Math.log(guess);
  u0 = u0 < uMin ? uMin : u0 > uMax ? uMax : u0;
  let g0 = logResidual(u0, q);
  if (g0 === 0) return Math.exp(u0);
  let slope = exponent;
  if (tKnown > 0 && sfKnown > 0) {
    const uk = Math.log(tKnown);
    const gk = Math.log(sfKnown) - q.lnTarget;
    if (uk !== u0) {
      if (gk < 0 !== g0 < 0) return bracketed(q, uk, gk, u0, g0);
      const sl = (g0 - gk) / (u0 - uk);
      if (sl > 0.05 * exponent && Number.isFinite(sl)) slope = sl;
    }
  }
  for (let iter = 0; iter < 200; iter++) {
    let step = -g0 / slope;
    // at least 1 % and at most a factor e⁴ per step
    if (Math.abs(step) < 0.01) step = step < 0 ? -0.01 : 0.01;
    else if (step > 4) step = 4;
    else if (step < -4) step = -4;
    let u1 = u0 + step;
    u1 = u1 < uMin ? uMin : u1 > uMax ? uMax : u1;
    if (u1 === u0) return g0 < 0 ? null : tMin; // pinned at a bound
    const g1 = logResidual(u1, q);
    if (g1 === 0) return Math.exp(u1);
    if (g0 < 0 !== g1 < 0) return bracketed(q, u0, g0, u1, g1);
    const sl = (g1 - g0) / (u1 - u0);
    slope = sl > 0.05 * exponent && Number.isFinite(sl) ? sl : exponent;
    u0 = u1;
    g0 = g1;
  }
  return null;
}

/** Brent between two log-thicknesses whose residuals differ in sign; stops at 1e-8 in ln t or ln sf (far below display precision). */
function bracketed<C>(q: LogProblem<C>, ua: number, ga: number, ub: number, gb: number): number {
  const u = ga < 0 ? brent(logResidual, q, ua, ub, ga, gb, 1e-8, 200, 1e-8) : brent(logResidual, q, ub, ua, gb, ga, 1e-8, 200, 1e-8);
  return Math.exp(u);
}
