// Integer powers x^e for a fixed set of exponents, evaluated as a short addition chain built once
// at load time. A plain x, x², x³ … loop is one long chain of dependent multiplications; a plan
// with each power the product of two earlier ones keeps the chains short (x^41 in 7 steps
// instead of 40), which is most of the cost of the IF97 basic equations.

/** A compiled plan: pow[target[k]] = pow[left[k]] · pow[right[k]], in order; pow[0] = 1, pow[1] = x. */
export interface PowerPlan {
  readonly size: number;
  readonly target: Int32Array;
  readonly left: Int32Array;
  readonly right: Int32Array;
}

/** Builds a plan that fills pow[e] for every e in `exponents` (each 0 ≤ e ≤ 255). */
export function buildPowerPlan(exponents: readonly number[]): PowerPlan {
  const maxE = Math.max(1, ...exponents);
  const depth = new Int32Array(maxE + 1).fill(-1);
  depth[0] = 0;
  depth[1] = 0;
  const steps: [number, number, number][] = [];
  const ensure = (e: number): void => {
    if ((depth[e] as number) >= 0) return;
    let best = -1;
    let bestDepth = Number.POSITIVE_INFINITY;
    for (let x = 1; x <= e - x; x++) {
      const dx = depth[x] as number, dy = depth[e - x] as number;
      if (dx >= 0 && dy >= 0 && Math.max(dx, dy) < bestDepth) {
        best = x;
        bestDepth = Math.max(dx, dy);
      }
    }
    if (best < 0) {
      // No split of known powers yet: halve (x^e = x^⌊e/2⌋ · x^⌈e/2⌉), building both halves.
      best = Math.floor(e / 2);
      ensure(best);
      ensure(e - best);
      bestDepth = Math.max(depth[best] as number, depth[e - best] as number);
    }
    steps.push([e, best, e - best]);
    depth[e] = bestDepth + 1;
  };
  for (const e of [...new Set(exponents)].sort((a, b) => a - b)) ensure(e);
  return {
    size: maxE + 1,
    target: Int32Array.from(steps, (s) => s[0]),
    left: Int32Array.from(steps, (s) => s[1]),
    right: Int32Array.from(steps, (s) => s[2]),
  };
}

/** Fills pow (length ≥ plan.size) with the planned powers of x. No allocation. */
export function runPowerPlan(plan: PowerPlan, x: number, pow: Float64Array): void {
  pow[0] = 1;
  pow[1] = x;
  const { target, left, right } = plan;
  for (let k = 0; k < target.length; k++) {
    pow[target[k] as number] = (pow[left[k] as number] as number) * (pow[right[k] as number] as number);
  }
}
